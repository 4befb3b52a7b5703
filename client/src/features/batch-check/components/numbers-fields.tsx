import { useId } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';
import { STAGE_SUGAR_RULES, SUGAR_TYPES, SUGAR_TYPE_IDS } from '@shared/batch-check-model';
import { MASS_UNITS } from '@shared/units';
import { STAGE_IDS, type StageId } from '@shared/vocabulary';
import { cx } from '../../../components/ui/cx';
import { SelectField } from './form-fields';

export type NumberFieldName =
  | 'culture.value'
  | 'culture.unit'
  | 'sugar.value'
  | 'sugar.unit'
  | 'sugarType'
  | 'moisturePct'
  | 'containerWeight.value'
  | 'containerWeight.unit';

/** How a form hands its own fields to these controls: register props and the field's error. */
export type BindNumberField = (name: NumberFieldName) => { props: UseFormRegisterReturn; error?: string };

const UNIT_OPTIONS = MASS_UNITS.map((unit) => ({ value: unit, label: unit }));
const SUGAR_OPTIONS = SUGAR_TYPE_IDS.map((id) => ({ value: id, label: SUGAR_TYPES[id].label.replace(/^./, (c) => c.toUpperCase()) }));

function WeightField({
  legend,
  hint,
  bind,
  base,
}: {
  legend: string;
  hint?: string;
  bind: BindNumberField;
  base: 'culture' | 'sugar' | 'containerWeight';
}) {
  const id = useId();
  const value = bind(`${base}.value`);
  const unit = bind(`${base}.unit`);
  const error = value.error ?? unit.error;
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  return (
    <fieldset className="flex flex-col gap-1" aria-describedby={[hintId, errorId].filter(Boolean).join(' ') || undefined}>
      <legend className="font-bold">{legend}</legend>
      {hint && (
        <p id={hintId} className="text-base text-loam-soft">
          {hint}
        </p>
      )}
      <div className="flex gap-2">
        <label htmlFor={`${id}-value`} className="sr-only">
          {legend}, amount
        </label>
        <input
          id={`${id}-value`}
          type="number"
          inputMode="decimal"
          step="any"
          min={0}
          aria-invalid={value.error ? true : undefined}
          aria-describedby={errorId}
          className={cx(
            'min-h-12 w-full min-w-0 flex-1 rounded-soft border-2 bg-rice px-3 py-2 text-lg text-loam',
            value.error ? 'border-ember' : 'border-loam-soft',
          )}
          {...value.props}
        />
        <label htmlFor={`${id}-unit`} className="sr-only">
          {legend}, unit
        </label>
        <select
          id={`${id}-unit`}
          aria-invalid={unit.error ? true : undefined}
          className={cx('min-h-12 w-24 rounded-soft border-2 bg-rice px-2 text-lg', unit.error ? 'border-ember' : 'border-loam-soft')}
          {...unit.props}
        >
          {UNIT_OPTIONS.map((option) => (
            <option key={option.value} value={option.value}>
              {option.label}
            </option>
          ))}
        </select>
      </div>
      {error && (
        <p id={errorId} className="font-semibold text-ember">
          {error}
        </p>
      )}
    </fieldset>
  );
}

function moistureHint(stage: string | undefined): string {
  const rule = stage && (STAGE_IDS as readonly string[]).includes(stage) ? STAGE_SUGAR_RULES[stage as StageId] : null;
  if (!rule) return 'Water in the material, in percent. Choose the stage to see the usual value.';
  if (rule.moisturePct === null) return `Water in the material, in percent. ${rule.moistureSource.replace(/^no default: /, 'There is no usual value for this stage: ')}.`;
  // The source of the usual value is shown with the check's notes; here only what it means.
  return `Leave it empty to use ${rule.moisturePct} %, the usual value for ${rule.stage}. Enter your own if you measured it.`;
}

/** The weights and what the sugar & water check needs, for any form that carries them. */
export function NumbersFields({
  bind,
  stage,
  withContainerWeight = false,
}: {
  bind: BindNumberField;
  stage: string | undefined;
  withContainerWeight?: boolean;
}) {
  const moisture = bind('moisturePct');
  const moistureId = useId();
  const sugarType = bind('sugarType');
  return (
    <div className="grid gap-5 sm:grid-cols-2">
      <WeightField legend="Culture weight" hint="The rice, plant material or fruit, without the container." bind={bind} base="culture" />
      <WeightField legend="Sugar weight" hint="Everything mixed in or on top so far; 0 if none yet." bind={bind} base="sugar" />
      <SelectField label="Sugar type" options={SUGAR_OPTIONS} error={sugarType.error} {...sugarType.props} />
      <div className="flex flex-col gap-1 sm:col-span-2">
        <label htmlFor={moistureId} className="font-bold">
          Moisture of the material, % <span className="font-normal text-loam-soft">(optional)</span>
        </label>
        <p id={`${moistureId}-hint`} className="text-base text-loam-soft">
          {moistureHint(stage)}
        </p>
        <input
          id={moistureId}
          type="number"
          inputMode="decimal"
          step="any"
          min={0}
          max={100}
          aria-describedby={cx(`${moistureId}-hint`, moisture.error && `${moistureId}-error`)}
          aria-invalid={moisture.error ? true : undefined}
          className={cx(
            'min-h-12 w-full max-w-40 rounded-soft border-2 bg-rice px-3 py-2 text-lg text-loam',
            moisture.error ? 'border-ember' : 'border-loam-soft',
          )}
          {...moisture.props}
        />
        {moisture.error && (
          <p id={`${moistureId}-error`} className="font-semibold text-ember">
            {moisture.error}
          </p>
        )}
      </div>
      {withContainerWeight && (
        <div className="sm:col-span-2">
          <WeightField
            legend="Empty container weight (optional)"
            hint="Only for the check: it tells you what the scale should read with the container on it. Not saved."
            bind={bind}
            base="containerWeight"
          />
        </div>
      )}
    </div>
  );
}
