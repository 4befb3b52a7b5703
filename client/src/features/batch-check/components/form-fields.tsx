// Form controls the batch form and the case form share, drawn like the app's TextField.
import { useId, type ComponentProps, type ReactNode } from 'react';
import { cx } from '../../../components/ui/cx';

const CONTROL = 'min-h-12 w-full rounded-soft border-2 bg-rice px-3 py-2 text-lg text-loam';

function describedBy(...ids: Array<string | undefined>): string | undefined {
  return ids.filter(Boolean).join(' ') || undefined;
}

function FieldFrame({
  id,
  label,
  hint,
  error,
  className,
  children,
}: {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  className?: string;
  children: ReactNode;
}) {
  return (
    <div className={cx('flex flex-col gap-1', className)}>
      <label htmlFor={id} className="font-bold">
        {label}
      </label>
      {hint && (
        <p id={`${id}-hint`} className="text-base text-loam-soft">
          {hint}
        </p>
      )}
      {children}
      {error && (
        <p id={`${id}-error`} className="font-semibold text-ember">
          {error}
        </p>
      )}
    </div>
  );
}

export type SelectFieldProps = ComponentProps<'select'> & {
  label: string;
  hint?: ReactNode;
  error?: string;
  options: ReadonlyArray<{ value: string; label: string }>;
  /** an empty first choice, e.g. "Choose a stage" */
  placeholder?: string;
};

export function SelectField({ label, hint, error, options, placeholder, id, className, ...select }: SelectFieldProps) {
  const generated = useId();
  const fieldId = id ?? generated;
  return (
    <FieldFrame id={fieldId} label={label} hint={hint} error={error} className={className}>
      <select
        id={fieldId}
        aria-describedby={describedBy(hint ? `${fieldId}-hint` : undefined, error ? `${fieldId}-error` : undefined)}
        aria-invalid={error ? true : undefined}
        className={cx(CONTROL, error ? 'border-ember' : 'border-loam-soft')}
        {...select}
      >
        {placeholder !== undefined && <option value="">{placeholder}</option>}
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
    </FieldFrame>
  );
}

export type TextAreaFieldProps = ComponentProps<'textarea'> & { label: string; hint?: ReactNode; error?: string };

export function TextAreaField({ label, hint, error, id, className, rows = 4, ...textarea }: TextAreaFieldProps) {
  const generated = useId();
  const fieldId = id ?? generated;
  return (
    <FieldFrame id={fieldId} label={label} hint={hint} error={error} className={className}>
      <textarea
        id={fieldId}
        rows={rows}
        aria-describedby={describedBy(hint ? `${fieldId}-hint` : undefined, error ? `${fieldId}-error` : undefined)}
        aria-invalid={error ? true : undefined}
        className={cx(CONTROL, 'leading-snug', error ? 'border-ember' : 'border-loam-soft')}
        {...textarea}
      />
    </FieldFrame>
  );
}
