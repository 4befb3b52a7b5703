import { useId } from 'react';
import { cx } from '../../../components/ui/cx';

// What the stars say of the advice, whatever became of the batch (a lost batch can have had the right advice).
const WORDS = ['', 'not helpful', 'a little helpful', 'helpful', 'very helpful', 'just what I needed'];

/** Five radio buttons drawn as stars; the words say what each means. */
export function StarRating({
  value,
  onChange,
  error,
  legend,
}: {
  value: number | undefined;
  onChange: (stars: number) => void;
  error?: string;
  legend: string;
}) {
  const id = useId();
  return (
    <fieldset aria-describedby={error ? `${id}-error` : undefined} className="flex flex-col gap-2">
      <legend className="font-bold">{legend}</legend>
      <div className="flex flex-wrap gap-1">
        {[1, 2, 3, 4, 5].map((n) => {
          const lit = value !== undefined && n <= value;
          return (
            <label
              key={n}
              className="flex min-h-11 min-w-11 cursor-pointer items-center justify-center rounded-soft has-focus-visible:outline-3 has-focus-visible:outline-loam"
            >
              <input type="radio" name={`${id}-stars`} value={n} checked={value === n} onChange={() => onChange(n)} className="sr-only" />
              <svg aria-hidden="true" viewBox="0 0 24 24" className={cx('size-9', lit ? 'fill-clay text-clay-deep' : 'fill-rice text-loam-soft')} stroke="currentColor" strokeWidth="1.5">
                <path d="M12 2.8l2.8 5.9 6.4.8-4.7 4.4 1.2 6.4L12 17.2l-5.7 3.1 1.2-6.4L2.8 9.5l6.4-.8z" strokeLinejoin="round" />
              </svg>
              <span className="sr-only">
                {n} {n === 1 ? 'star' : 'stars'}: {WORDS[n]}
              </span>
            </label>
          );
        })}
      </div>
      <p className="text-loam-soft" aria-live="polite">
        {value ? `${value} of 5: ${WORDS[value]}` : 'Choose from 1 to 5 stars.'}
      </p>
      {error && (
        <p id={`${id}-error`} className="font-semibold text-ember">
          {error}
        </p>
      )}
    </fieldset>
  );
}
