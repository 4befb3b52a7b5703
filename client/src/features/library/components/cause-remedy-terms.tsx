import { CAUSES, REMEDIES, labelOf } from '@shared/vocabulary';

/** The "Likely cause" and "What was done" pair of a field note, as terms of a description list. */
export function CauseRemedyTerms({ cause, remedy }: { cause: string | null; remedy: string | null }) {
  return (
    <>
      {cause && (
        <>
          <dt className="font-bold">Likely cause</dt>
          <dd>{labelOf(CAUSES, cause)}</dd>
        </>
      )}
      {remedy && (
        <>
          <dt className="font-bold">What was done</dt>
          <dd>{labelOf(REMEDIES, remedy)}</dd>
        </>
      )}
    </>
  );
}
