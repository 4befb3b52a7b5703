import { useEffect, useId, useRef, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { useMentorChoices, type MentorChoice } from '../api/get-mentors';

const load = (m: MentorChoice) => (m.openCases === 0 ? 'no open cases' : m.openCases === 1 ? '1 open case' : `${m.openCases} open cases`);

/**
 * Handing a case to another mentor (PRODUCT.md screen 5): the mentor who holds it, when it
 * needs other hands (a stage they know less, time away), or a steward. The list says how many
 * open cases each mentor holds, so the load can be shared.
 */
export function HandOverForm({
  currentMentorId,
  growerId,
  busy,
  onHandOver,
}: {
  currentMentorId: number | null;
  growerId: number;
  busy: boolean;
  onHandOver: (mentorId: number) => void;
}) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const [chosen, setChosen] = useState('');
  const selectRef = useRef<HTMLSelectElement>(null);
  const openerRef = useRef<HTMLButtonElement>(null);
  const wasOpen = useRef(false);
  const mentors = useMentorChoices(open);
  const choices = (mentors.data ?? []).filter((m) => m.id !== currentMentorId && m.id !== growerId);

  // Focus goes to what appeared, and back to the button when the choice is put away.
  useEffect(() => {
    if (open) selectRef.current?.focus();
    else if (wasOpen.current) openerRef.current?.focus();
    wasOpen.current = open;
  }, [open]);

  if (!open) {
    return (
      <Button ref={openerRef} variant="secondary" onClick={() => setOpen(true)} disabled={busy}>
        {currentMentorId ? 'Hand over' : 'Give to a mentor'}
      </Button>
    );
  }
  const noneLeft = mentors.isSuccess && choices.length === 0;
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      aria-label="Hand this case to another mentor"
      onSubmit={(event) => {
        event.preventDefault();
        if (chosen) onHandOver(Number(chosen));
      }}
    >
      <div className="flex flex-col gap-1">
        <label htmlFor={id} className="font-bold">
          Hand to
        </label>
        <select
          ref={selectRef}
          id={id}
          value={chosen}
          onChange={(event) => setChosen(event.target.value)}
          className="min-h-11 max-w-full rounded-soft border-2 border-loam-soft bg-rice px-3 text-base"
          disabled={mentors.isPending || noneLeft}
        >
          <option value="">{mentors.isPending ? 'Loading mentors…' : noneLeft ? 'No other mentor is active' : 'Choose a mentor'}</option>
          {choices.map((m) => (
            <option key={m.id} value={m.id}>
              {m.displayName} — {load(m)}
            </option>
          ))}
        </select>
      </div>
      <Button type="submit" disabled={!chosen || busy}>
        Hand over
      </Button>
      <Button variant="quiet" onClick={() => setOpen(false)}>
        Cancel
      </Button>
      {mentors.error && <p className="w-full font-semibold text-ember">{mentors.error.message}</p>}
    </form>
  );
}
