import { Link } from 'react-router';
import type { ClosingState } from '@shared/closing-schemas';
import { OUTCOME_LABELS } from '@shared/outcomes';
import { CAUSES, REMEDIES, labelOf } from '@shared/vocabulary';
import { dayMonth } from '../../../lib/english-dates';

const dayText = (iso: string) => dayMonth(new Date(iso));

/** What closing recorded, the check-ins, and how the case ended. */
export function ClosingRecord({ state }: { state: ClosingState }) {
  return (
    <div className="flex flex-col gap-3">
      <p className="text-loam-soft">
        Closed {state.closedAt && dayText(state.closedAt)}
        {state.closedBy && (
          <>
            {' '}
            by <Link to={`/mentors/${state.closedBy.id}`}>{state.closedBy.displayName}</Link>
          </>
        )}
        .
      </p>
      <dl className="grid gap-x-4 gap-y-1 sm:grid-cols-[auto_1fr]">
        {state.cause && (
          <>
            <dt className="font-bold">Likely cause</dt>
            <dd>
              {labelOf(CAUSES, state.cause)}
              {state.causeNotes && <span className="block text-loam-soft">{state.causeNotes}</span>}
            </dd>
          </>
        )}
        {state.remedy && (
          <>
            <dt className="font-bold">Remedy</dt>
            <dd>
              {labelOf(REMEDIES, state.remedy)}
              {state.remedyNotes && <span className="block text-loam-soft">{state.remedyNotes}</span>}
            </dd>
          </>
        )}
        {state.summary && (
          <>
            <dt className="font-bold">Summary</dt>
            <dd className="whitespace-pre-line">{state.summary}</dd>
          </>
        )}
        {state.outcome && (
          <>
            <dt className="font-bold">How it turned out</dt>
            <dd>
              {OUTCOME_LABELS[state.outcome]}
              {state.stars && <>, advice rated {state.stars} of 5</>}
              {state.recoveryComment && <span className="block text-loam-soft">“{state.recoveryComment}”</span>}
            </dd>
          </>
        )}
        {state.status === 'lost' && !state.outcome && (
          <>
            <dt className="font-bold">How it turned out</dt>
            <dd>Closed as lost: no recovery report came in.</dd>
          </>
        )}
      </dl>
      {state.status === 'watching' && state.checkIns.length > 0 && (
        <p>
          <span className="font-bold">Check-ins: </span>
          {state.checkIns.map((c, i) => (
            <span key={c.day}>
              {i > 0 && ', '}
              day {c.day} {c.sentAt ? '(sent)' : `(${dayText(c.dueAt)})`}
            </span>
          ))}
        </p>
      )}
      {state.published && state.noteSlug && (
        <p>
          Shared in the Field Library: <Link to={`/library/${state.noteSlug}`}>read the field note</Link>
        </p>
      )}
      {/* The grower reads this in their own "Sharing this case" section. */}
      {state.libraryHold && !state.can.changeConsent && <LibraryHoldText hold={state.libraryHold} consentToPublish={state.consentToPublish} reader="staff" />}
    </div>
  );
}

/**
 * Who took the field note out of the Field Library, when, and why, and what keeps it out: the hold
 * alone while the grower still agrees to share the case, or (once they no longer do) their choice.
 */
export function LibraryHoldText({
  hold,
  consentToPublish,
  reader,
}: {
  hold: NonNullable<ClosingState['libraryHold']>;
  consentToPublish: boolean;
  reader: 'grower' | 'staff';
}) {
  const staysOut = consentToPublish
    ? 'it stays out until a steward puts it back'
    : reader === 'grower'
      ? 'since you no longer agree to share this case, it stays out'
      : 'the grower no longer agrees to share the case, so it stays out';
  return (
    <p>
      <span className="font-bold">Out of the Field Library:</span> {hold.by?.displayName ?? 'A steward'} took the field note out on {dayText(hold.at)}
      ; {staysOut}. The reason given: “{hold.reason}”
    </p>
  );
}
