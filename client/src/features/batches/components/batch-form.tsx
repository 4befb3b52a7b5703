import { useState } from 'react';
import { get, useForm, useWatch, type Path } from 'react-hook-form';
import { SUGAR_TYPE_IDS, type SugarTypeId } from '@shared/batch-check-model';
import { batchCreateSchema, type BatchCreate, type BatchCreateInput, type BatchView } from '@shared/case-schemas';
import type { MassUnit } from '@shared/units';
import { STAGES } from '@shared/vocabulary';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField } from '../../../components/ui/text-field';
import { applyFieldErrors } from '../../../lib/form-errors';
import { BatchCheckPanel } from '../../batch-check/components/batch-check-panel';
import { SelectField, TextAreaField } from '../../batch-check/components/form-fields';
import { NumbersFields, type BindNumberField } from '../../batch-check/components/numbers-fields';
import { useLiveBatchCheck } from '../../batch-check/hooks/use-live-batch-check';
import { bodyResolver } from '../../batch-check/lib/body-resolver';
import { todayIso } from '../lib/batch-format';

/** What the inputs hold; number inputs read NaN when empty. */
export interface BatchFormValues {
  stage: string;
  label: string;
  madeOn: string;
  ingredients: string;
  culture: { value: number; unit: MassUnit };
  sugar: { value: number; unit: MassUnit };
  sugarType: SugarTypeId;
  moisturePct: number;
  /** only for the live check; never sent */
  containerWeight: { value: number; unit: MassUnit };
  container: string;
  cover: string;
  location: string;
  notes: string;
}

const finite = (n: unknown): n is number => typeof n === 'number' && Number.isFinite(n);

/** The request body: an empty weight or moisture is unknown (null), which PATCH also uses to clear. */
function toBatchBody(v: BatchFormValues): BatchCreateInput {
  return {
    // An unchosen stage stays '' so the schema answers "Choose the stage of the batch."
    stage: v.stage as BatchCreateInput['stage'],
    label: v.label,
    madeOn: v.madeOn,
    ingredients: v.ingredients,
    culture: finite(v.culture.value) ? v.culture : null,
    sugar: finite(v.sugar.value) ? v.sugar : null,
    sugarType: v.sugarType || null,
    moisturePct: finite(v.moisturePct) ? v.moisturePct : null,
    container: v.container,
    cover: v.cover,
    location: v.location,
    notes: v.notes,
  };
}

// The server's own schema checks the form, so both say the same thing about the same field.
const resolver = bodyResolver(batchCreateSchema, toBatchBody);

const FIELD_NAMES = [
  'stage', 'label', 'madeOn', 'ingredients', 'culture.value', 'culture.unit', 'sugar.value', 'sugar.unit', 'sugarType',
  'moisturePct', 'container', 'cover', 'location', 'notes',
] as const satisfies readonly Path<BatchFormValues>[];

export function batchFormDefaults(batch?: BatchView): BatchFormValues {
  return {
    stage: batch?.stage ?? '',
    label: batch?.label ?? '',
    madeOn: batch?.madeOn ?? todayIso(),
    ingredients: batch?.ingredients ?? '',
    culture: { value: batch?.culture?.value ?? NaN, unit: batch?.culture?.unit ?? 'g' },
    sugar: { value: batch?.sugar?.value ?? NaN, unit: batch?.sugar?.unit ?? batch?.culture?.unit ?? 'g' },
    sugarType: batch?.sugarType ?? SUGAR_TYPE_IDS[0],
    moisturePct: batch?.moisturePct ?? NaN,
    containerWeight: { value: NaN, unit: 'g' },
    container: batch?.container ?? '',
    cover: batch?.cover ?? '',
    location: batch?.location ?? '',
    notes: batch?.notes ?? '',
  };
}

const STAGE_OPTIONS = STAGES.map((s) => ({ value: s.id, label: s.label }));

/** Add or edit a batch, with the sugar & water check beside it (below on a phone). */
export function BatchForm({
  batch,
  submitLabel,
  pendingLabel,
  onSave,
  isPending,
}: {
  batch?: BatchView;
  submitLabel: string;
  pendingLabel: string;
  onSave: (body: BatchCreate) => Promise<unknown>;
  isPending: boolean;
}) {
  const [failure, setFailure] = useState<string | null>(null);
  const form = useForm<BatchFormValues, unknown, BatchCreate>({ resolver, defaultValues: batchFormDefaults(batch) });
  const { errors } = form.formState;
  const watched = useWatch({ control: form.control });
  const check = useLiveBatchCheck({
    stage: watched.stage,
    culture: watched.culture,
    sugar: watched.sugar,
    sugarType: watched.sugarType,
    moisturePct: watched.moisturePct,
    containerWeight: watched.containerWeight,
  });

  const bind: BindNumberField = (name) => ({
    props: form.register(name, name.endsWith('.value') || name === 'moisturePct' ? { valueAsNumber: true } : undefined),
    error: (get(errors, name) as { message?: string } | undefined)?.message,
  });

  const onSubmit = form.handleSubmit(async (body) => {
    setFailure(null);
    try {
      await onSave(body);
    } catch (error) {
      if (!applyFieldErrors(error, form.setError, FIELD_NAMES)) {
        setFailure(error instanceof Error ? error.message : 'The batch could not be saved.');
      }
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_minmax(0,26rem)] lg:grid-rows-[auto_1fr] lg:items-start">
      <div className="flex flex-col gap-8 lg:col-start-1">
        <FormAlert title="The batch was not saved" message={failure} />
        <fieldset className="flex flex-col gap-5">
          <legend className="mb-3 text-xl font-extrabold">The batch</legend>
          <SelectField label="Stage" placeholder="Choose a stage" options={STAGE_OPTIONS} error={errors.stage?.message} {...form.register('stage')} />
          <TextField
            label="Label"
            hint="What is written on the jar, e.g. “Cedar hollow IMO2, jar 3”."
            autoComplete="off"
            error={errors.label?.message}
            {...form.register('label')}
          />
          <TextField label="Made on" type="date" max={todayIso()} error={errors.madeOn?.message} {...form.register('madeOn')} />
          <TextAreaField
            label="Ingredients"
            hint="What went in: the rice or plant, where you gathered it, any water."
            rows={3}
            error={errors.ingredients?.message}
            {...form.register('ingredients')}
          />
        </fieldset>

        <fieldset className="flex flex-col gap-5">
          <legend className="mb-3 text-xl font-extrabold">The numbers</legend>
          <NumbersFields bind={bind} stage={watched.stage} withContainerWeight />
        </fieldset>
      </div>

      <aside aria-label="Sugar and water check of this batch" className="lg:sticky lg:top-4 lg:col-start-2 lg:row-span-2 lg:row-start-1">
        <BatchCheckPanel check={check} />
      </aside>

      <div className="flex flex-col gap-8 lg:col-start-1">
        <fieldset className="flex flex-col gap-5">
          <legend className="mb-3 text-xl font-extrabold">How and where it is kept</legend>
          <div className="grid gap-5 sm:grid-cols-2">
            <TextField label="Container" hint="e.g. clay crock, glass jar, wooden box" error={errors.container?.message} {...form.register('container')} />
            <TextField label="Cover" hint="e.g. paper and string, cloth, loose lid" error={errors.cover?.message} {...form.register('cover')} />
          </div>
          <TextField
            label="Where it sits"
            hint="e.g. shade of the shed, indoors on a shelf, under the hedge"
            error={errors.location?.message}
            {...form.register('location')}
          />
          <TextAreaField label="Notes" rows={3} error={errors.notes?.message} {...form.register('notes')} />
        </fieldset>
        <Button type="submit" disabled={isPending || form.formState.isSubmitting} className="self-start">
          {isPending ? pendingLabel : submitLabel}
        </Button>
      </div>
    </form>
  );
}
