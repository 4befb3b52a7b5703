// A labelled select and text area in the TextField look (components/ui has the input only).
import { useId, type ComponentProps, type ReactNode } from 'react';
import { cx } from '../../../components/ui/cx';

const CONTROL = 'w-full rounded-soft border-2 bg-rice px-3 py-2 text-lg text-loam';

interface FieldText {
  label: string;
  hint?: string;
  error?: string;
}

/** Label, standing hint and error around one control, wired up with ids for screen readers. */
function Field({ label, hint, error, id, className, control }: FieldText & { id?: string; className?: string; control: (a11y: { id: string; 'aria-describedby'?: string; 'aria-invalid'?: true }) => ReactNode }) {
  const generated = useId();
  const controlId = id ?? generated;
  const describedBy = [hint && `${controlId}-hint`, error && `${controlId}-error`].filter(Boolean).join(' ') || undefined;
  return (
    <div className={cx('flex flex-col gap-1', className)}>
      <label htmlFor={controlId} className="font-bold">
        {label}
      </label>
      {hint && (
        <p id={`${controlId}-hint`} className="text-base text-loam-soft">
          {hint}
        </p>
      )}
      {control({ id: controlId, 'aria-describedby': describedBy, 'aria-invalid': error ? true : undefined })}
      {error && (
        <p id={`${controlId}-error`} className="font-semibold text-ember">
          {error}
        </p>
      )}
    </div>
  );
}

export function SelectField({ label, hint, error, className, id, children, ...select }: ComponentProps<'select'> & FieldText) {
  return (
    <Field
      {...{ label, hint, error, id, className }}
      control={(a11y) => (
        <select {...a11y} className={cx(CONTROL, 'min-h-12', error ? 'border-ember' : 'border-loam-soft')} {...select}>
          {children}
        </select>
      )}
    />
  );
}

export function TextAreaField({ label, hint, error, className, id, ...area }: ComponentProps<'textarea'> & FieldText) {
  return (
    <Field
      {...{ label, hint, error, id, className }}
      control={(a11y) => <textarea {...a11y} className={cx(CONTROL, 'min-h-24', error ? 'border-ember' : 'border-loam-soft')} {...area} />}
    />
  );
}
