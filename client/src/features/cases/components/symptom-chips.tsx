import type { UseFormRegisterReturn } from 'react-hook-form';
import { DISCARD_SIGNS } from '@shared/cautions';
import { SYMPTOMS, SYMPTOM_GROUPS } from '@shared/vocabulary';
import { cx } from '../../../components/ui/cx';

const DISCARD = new Set<string>(DISCARD_SIGNS);

/**
 * Symptoms as toggle chips, grouped as the trade groups them. Each chip is a real checkbox
 * (hidden visually, not from assistive tech), so keyboard and screen readers work as usual.
 */
export function SymptomChips({ register, error }: { register: UseFormRegisterReturn; error?: string }) {
  return (
    <div className="flex flex-col gap-4">
      {SYMPTOM_GROUPS.map((group) => (
        <fieldset key={group.id}>
          <legend className="font-bold">{group.label}</legend>
          <div className="mt-2 flex flex-wrap gap-2">
            {SYMPTOMS.filter((s) => s.group === group.id).map((symptom) => (
              <label key={symptom.id} className="relative">
                <input type="checkbox" value={symptom.id} className="peer absolute inset-0 size-full cursor-pointer opacity-0" {...register} />
                <span
                  className={cx(
                    'pointer-events-none flex min-h-11 items-center gap-1.5 rounded-full border-2 px-3.5 py-1.5 font-semibold select-none',
                    'border-loam-soft bg-rice text-loam',
                    'peer-checked:border-moss-deep peer-checked:bg-moss-deep peer-checked:text-rice',
                    'peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-loam',
                  )}
                >
                  <CheckMark />
                  {symptom.label}
                  {DISCARD.has(symptom.id) && <span className="sr-only"> (a sign to discard the batch)</span>}
                </span>
              </label>
            ))}
          </div>
        </fieldset>
      ))}
      {error && <p className="font-semibold text-ember">{error}</p>}
    </div>
  );
}

function CheckMark() {
  // Shown only when ticked (the parent is the checked peer's sibling), so the state is not colour alone.
  return (
    <svg aria-hidden="true" viewBox="0 0 16 16" className="hidden size-4 [.peer:checked+span_&]:block" fill="none" stroke="currentColor" strokeWidth="2.5">
      <path d="M3 8.5l3 3 7-7" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}
