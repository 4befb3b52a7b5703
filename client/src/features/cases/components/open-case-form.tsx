import { useMemo, useState } from 'react';
import { get, useForm, useWatch, type Path } from 'react-hook-form';
import { SUGAR_TYPE_IDS, type SugarTypeId } from '@shared/batch-check-model';
import { discardNote } from '@shared/cautions';
import {
  caseNumbersSchema,
  openCaseSchema,
  type BatchView,
  type CaseDetail,
  type OpenCase,
  type OpenCaseInput,
  type SimilarDraftInput,
} from '@shared/case-schemas';
import type { MassUnit } from '@shared/units';
import { URGENCY_WEIGHTS } from '@shared/urgency';
import { STAGES, SYMPTOMS, type StageId, type SymptomId } from '@shared/vocabulary';
import { SafetyCautions } from '../../../components/safety-cautions';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField } from '../../../components/ui/text-field';
import { applyFieldErrors } from '../../../lib/form-errors';
import { BatchCheckPanel } from '../../batch-check/components/batch-check-panel';
import { SelectField, TextAreaField } from '../../batch-check/components/form-fields';
import { NumbersFields, type BindNumberField } from '../../batch-check/components/numbers-fields';
import { useLiveBatchCheck } from '../../batch-check/hooks/use-live-batch-check';
import { bodyResolver } from '../../batch-check/lib/body-resolver';
import { todayIso } from '../../batches/lib/batch-format';
import { useCreateCase } from '../api/create-case';
import { useSimilarToDraft } from '../api/get-similar-cases';
import { useDebouncedValue } from '../hooks/use-debounced-value';
import { usePhotoDrafts } from '../hooks/use-photo-drafts';
import { PhotoPicker } from './photo-picker';
import { SimilarCasesList } from './similar-cases-list';
import { SymptomChips } from './symptom-chips';

/** What the inputs hold; number inputs read NaN when empty. */
export interface OpenCaseFormValues {
  stage: string;
  symptoms: string[];
  description: string;
  location: string;
  title: string;
  madeOn: string;
  numbers: {
    culture: { value: number; unit: MassUnit };
    sugar: { value: number; unit: MassUnit };
    sugarType: SugarTypeId;
    moisturePct: number;
  };
}

const finite = (n: unknown): n is number => typeof n === 'number' && Number.isFinite(n);

/** The numbers go only when the grower gave at least one weight; then both are checked. */
function numbersOf(v: OpenCaseFormValues): OpenCaseInput['numbers'] {
  const { culture, sugar, sugarType, moisturePct } = v.numbers;
  if (!finite(culture.value) && !finite(sugar.value)) return undefined;
  return {
    culture,
    sugar,
    sugarType: sugarType || undefined,
    moisturePct: finite(moisturePct) ? moisturePct : undefined,
  };
}

function toOpenCaseBody(v: OpenCaseFormValues, batchId: number | null): OpenCaseInput {
  return {
    batchId: batchId ?? undefined,
    stage: v.stage as StageId,
    symptoms: v.symptoms as SymptomId[],
    title: v.title.trim() || undefined,
    description: v.description,
    location: v.location,
    // A batch knows its own date; only a case from scratch sends one.
    madeOn: batchId === null && v.madeOn ? v.madeOn : undefined,
    numbers: numbersOf(v),
  };
}

const FIELD_NAMES = [
  'stage', 'symptoms', 'title', 'description', 'location', 'madeOn', 'numbers.culture.value', 'numbers.culture.unit',
  'numbers.sugar.value', 'numbers.sugar.unit', 'numbers.sugarType', 'numbers.moisturePct',
] as const satisfies readonly Path<OpenCaseFormValues>[];

function defaultsFor(batch: BatchView | null): OpenCaseFormValues {
  return {
    stage: batch?.stage ?? '',
    symptoms: [],
    description: '',
    location: batch?.location ?? '',
    title: '',
    madeOn: '',
    numbers: {
      culture: { value: batch?.culture?.value ?? NaN, unit: batch?.culture?.unit ?? 'g' },
      sugar: {
        // A batch still being gathered (IMO1) has no sugar yet, and that is a number too.
        value: batch?.sugar?.value ?? (batch?.stage === 'IMO1' && batch.culture ? 0 : NaN),
        unit: batch?.sugar?.unit ?? batch?.culture?.unit ?? 'g',
      },
      sugarType: batch?.sugarType ?? SUGAR_TYPE_IDS[0],
      moisturePct: batch?.moisturePct ?? NaN,
    },
  };
}

/** The title Sporewell would give a case left untitled: the stage and its weightiest symptom. */
function suggestedTitle(stage: string, symptoms: readonly string[]): string | null {
  if (!stage) return null;
  const weight = (id: string) => URGENCY_WEIGHTS.symptoms[id as SymptomId] ?? 0;
  const main = SYMPTOMS.find((s) => s.id === [...symptoms].sort((a, b) => weight(b) - weight(a))[0]);
  const who = stage === 'other' ? 'Batch' : stage;
  if (!main) return `${who} batch needs a second look`;
  const words = main.group === 'smell' ? `${main.label.toLowerCase()} smell` : main.group === 'colour' ? `${main.label.toLowerCase()} growth` : main.label.toLowerCase();
  return `${who}: ${words}${symptoms.length > 1 ? ` and ${symptoms.length - 1} more` : ''}`;
}

/** What "batches like this" is asked about; null until there is something to compare. */
function similarDraftOf(v: Partial<OpenCaseFormValues>): SimilarDraftInput | null {
  const symptoms = (v.symptoms ?? []) as SymptomId[];
  const description = (v.description ?? '').trim();
  if (!v.stage && symptoms.length === 0 && description.length < 3) return null;
  const numbers = v.numbers ? caseNumbersSchema.safeParse(numbersOf(v as OpenCaseFormValues)) : null;
  return {
    stage: (v.stage || undefined) as StageId | undefined,
    symptoms,
    title: (v.title ?? '').trim(),
    description,
    numbers: numbers?.success ? numbers.data : undefined,
  };
}

const STAGE_OPTIONS = STAGES.map((s) => ({ value: s.id, label: s.label }));

type Phase = { step: 'form' } | { step: 'photos'; created: CaseDetail } | { step: 'photos-failed'; created: CaseDetail; failed: number };

/**
 * Open a case: what the batch looks and smells like, the numbers and photos, with the sugar &
 * water check and "batches like this" answering while the grower types.
 */
export function OpenCaseForm({ batch, onOpened }: { batch: BatchView | null; onOpened: (created: CaseDetail) => void }) {
  const createCase = useCreateCase();
  const photos = usePhotoDrafts();
  const [failure, setFailure] = useState<string | null>(null);
  const [phase, setPhase] = useState<Phase>({ step: 'form' });
  const batchId = batch?.id ?? null;
  const resolver = useMemo(() => bodyResolver(openCaseSchema, (v: OpenCaseFormValues) => toOpenCaseBody(v, batchId)), [batchId]);
  const form = useForm<OpenCaseFormValues, unknown, OpenCase>({ resolver, defaultValues: defaultsFor(batch) });
  const { errors } = form.formState;
  const watched = useWatch({ control: form.control }) as Partial<OpenCaseFormValues>;
  const symptoms = watched.symptoms ?? [];

  const check = useLiveBatchCheck({
    stage: watched.stage,
    culture: watched.numbers?.culture,
    sugar: watched.numbers?.sugar,
    sugarType: watched.numbers?.sugarType,
    moisturePct: watched.numbers?.moisturePct,
    symptoms,
  });
  const discard = discardNote(symptoms);

  // useWatch hands back a new object on every render; the draft is keyed on its content.
  const watchedKey = JSON.stringify(watched);
  const draftNow = useMemo(() => similarDraftOf(JSON.parse(watchedKey) as Partial<OpenCaseFormValues>), [watchedKey]);
  const draft = useDebouncedValue(draftNow, 400);
  const similar = useSimilarToDraft(draft);
  const similarState =
    draft === null
      ? 'idle'
      : similar.isError
        ? 'error'
        : similar.isPending
          ? 'loading'
          : similar.isPlaceholderData || similar.isFetching
            ? 'refreshing'
            : 'ready';

  const bind: BindNumberField = (name) => {
    const path = `numbers.${name}` as Path<OpenCaseFormValues>;
    return {
      props: form.register(path, name.endsWith('.value') || name === 'moisturePct' ? { valueAsNumber: true } : undefined),
      error: (get(errors, path) as { message?: string } | undefined)?.message,
    };
  };

  const sendPhotos = async (created: CaseDetail) => {
    setPhase({ step: 'photos', created });
    const { failed } = await photos.uploadAll(created.id);
    if (failed > 0) setPhase({ step: 'photos-failed', created, failed });
    else onOpened(created);
  };

  const onSubmit = form.handleSubmit(async (body) => {
    setFailure(null);
    let created: CaseDetail;
    try {
      created = await createCase.mutateAsync(body);
    } catch (error) {
      if (!applyFieldErrors(error, form.setError, FIELD_NAMES)) {
        setFailure(error instanceof Error ? error.message : 'The case could not be opened.');
      }
      return;
    }
    if (photos.drafts.length === 0) onOpened(created);
    else await sendPhotos(created);
  });

  const busy = form.formState.isSubmitting || phase.step === 'photos';
  const suggestion = suggestedTitle(watched.stage ?? '', symptoms);

  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_minmax(0,26rem)] lg:grid-rows-[auto_1fr] lg:items-start">
      <div className="flex flex-col gap-8 lg:col-start-1">
        <FormAlert title="The case was not opened" message={failure} />

        <fieldset className="flex flex-col gap-5">
          <legend className="mb-3 text-xl font-extrabold">What is happening</legend>
          <SelectField
            label="Stage"
            placeholder="Choose a stage"
            options={STAGE_OPTIONS}
            error={errors.stage?.message}
            {...form.register('stage')}
          />
          <fieldset className="flex flex-col gap-2">
            <legend className="font-bold">What do you see and smell?</legend>
            <p className="text-base text-loam-soft">Tick every sign that fits; several may apply.</p>
            <SymptomChips register={form.register('symptoms')} error={(errors.symptoms as { message?: string } | undefined)?.message} />
          </fieldset>
          {discard && (
            <Alert tone="danger" title="This batch should be discarded, not rescued">
              <p>{discard}</p>
              <p className="mt-1">You can still open the case: a mentor can confirm and help you start again safely.</p>
            </Alert>
          )}
          <TextAreaField
            label="Describe it in your own words"
            hint="When did it change? What does it look, smell and feel like? Anything different about the weather or the place?"
            rows={5}
            error={errors.description?.message}
            {...form.register('description')}
          />
          <TextField
            label="Where the batch sits"
            hint="e.g. shade of the shed, indoors on a shelf, under the hedge"
            error={errors.location?.message}
            {...form.register('location')}
          />
          {batchId === null && (
            <TextField
              label="Made on (optional)"
              hint="The day you made the batch: young batches need help sooner."
              type="date"
              max={todayIso()}
              error={errors.madeOn?.message}
              {...form.register('madeOn')}
            />
          )}
        </fieldset>

        <fieldset className="flex flex-col gap-5">
          <legend className="mb-3 text-xl font-extrabold">The numbers {batch ? '(from your batch — change them if they moved on)' : '(optional)'}</legend>
          <p className="text-base text-loam-soft">With both weights, Sporewell checks the sugar and water for you, and a mentor sees the same numbers.</p>
          <NumbersFields bind={bind} stage={watched.stage} />
        </fieldset>
      </div>

      <aside aria-label="What Sporewell sees so far" className="flex flex-col gap-6 lg:col-start-2 lg:row-span-2 lg:row-start-1">
        <BatchCheckPanel check={check} />
        <SimilarCasesList
          items={similar.data?.items}
          state={similarState}
          error={similar.error?.message}
          emptyText="Choose the stage, tick what you see or describe it, and resolved cases like yours appear here."
        />
        <SafetyCautions />
      </aside>

      <div className="flex flex-col gap-8 lg:col-start-1">
        <PhotoPicker photos={photos} disabled={busy} />
        <TextField
          label="Title (optional)"
          hint={suggestion ? `Leave it empty to use “${suggestion}”.` : 'Leave it empty and Sporewell names the case from the stage and the main sign.'}
          placeholder={suggestion ?? undefined}
          autoComplete="off"
          error={errors.title?.message}
          {...form.register('title')}
        />

        {phase.step === 'photos' && (
          <Alert tone="info" title="Your case is open">
            Sending your photos — keep this page open until they are all sent.
          </Alert>
        )}
        {phase.step === 'photos-failed' && (
          <Alert tone="warning" title={`Your case is open, but ${phase.failed === 1 ? 'one photo was' : `${phase.failed} photos were`} not sent`}>
            <p>The reason is beside each photo. Try again, or go on and add photos from the case page later.</p>
            <div className="mt-3 flex flex-wrap gap-3">
              <Button onClick={() => void sendPhotos(phase.created)}>Try the photos again</Button>
              <Button variant="secondary" onClick={() => onOpened(phase.created)}>
                Go to the case
              </Button>
            </div>
          </Alert>
        )}
        {phase.step === 'form' && (
          <Button type="submit" disabled={busy} className="self-start px-6 text-lg">
            {form.formState.isSubmitting ? 'Opening the case…' : 'Open the case'}
          </Button>
        )}
      </div>
    </form>
  );
}
