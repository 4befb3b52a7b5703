import { useId, type ComponentProps } from 'react';
import { cx } from './cx';

export type TextFieldProps = ComponentProps<'input'> & {
  label: string;
  /** A standing rule, e.g. "At least 8 characters." Read out with the field. */
  hint?: string;
  error?: string;
};

export function TextField({ label, hint, error, id, className, ...input }: TextFieldProps) {
  const generatedId = useId();
  const inputId = id ?? generatedId;
  const hintId = hint ? `${inputId}-hint` : undefined;
  const errorId = error ? `${inputId}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;

  return (
    <div className={cx('flex flex-col gap-1', className)}>
      <label htmlFor={inputId} className="font-bold">
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-base text-loam-soft">
          {hint}
        </p>
      )}
      <input
        id={inputId}
        aria-describedby={describedBy}
        aria-invalid={error ? true : undefined}
        className={cx(
          'min-h-12 w-full rounded-soft border-2 bg-rice px-3 py-2 text-lg text-loam',
          error ? 'border-ember' : 'border-loam-soft',
        )}
        {...input}
      />
      {error && (
        <p id={errorId} className="font-semibold text-ember">
          {error}
        </p>
      )}
    </div>
  );
}

/** What an e-mail input needs on a phone: the e-mail keyboard, no capitals, no spelling fixes. */
export const emailInputProps = {
  type: 'email',
  autoComplete: 'email',
  autoCapitalize: 'none',
  spellCheck: false,
} as const;
