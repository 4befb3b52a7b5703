import { useState } from 'react';
import { Link } from 'react-router';
import { STAGES, labelOf } from '@shared/vocabulary';
import { useLibraryHolds } from '../api/get-library-holds';
import { formatDateTime } from '../lib/dates';
import { PagedList } from './paged-list';

/** Field notes a steward took out of the Field Library and that are still held out. */
export function LibraryHoldsPanel() {
  const [page, setPage] = useState(1);
  const holds = useLibraryHolds(page);
  return (
    <div>
      <p className="mb-4 max-w-prose text-loam-soft">
        Field notes taken out of the Field Library, newest first. Each stays out until a steward puts it back from its case page.
      </p>
      <PagedList
        query={holds}
        loadingLabel="Reading the notes held out…"
        errorTitle="The notes held out could not be loaded"
        empty="No field note is held out of the library. A steward takes one out from the note’s own page."
        page={page}
        onPage={setPage}
        pagerLabel="Pages of notes held out"
        className="flex flex-col divide-y divide-line rounded-soft border border-line bg-rice"
        itemClassName="flex flex-col gap-1 p-4"
        renderItem={(hold) => (
          <>
            <Link to={`/cases/${hold.caseId}`} className="font-extrabold">
              {hold.title}
            </Link>
            <p className="text-base text-loam-soft">
              {labelOf(STAGES, hold.stage)} · taken out by {hold.heldBy?.displayName ?? 'a steward'} on{' '}
              <time dateTime={hold.heldAt}>{formatDateTime(hold.heldAt)}</time>
              {hold.consentToPublish ? '' : ' · the grower no longer agrees to share it'}
            </p>
            <p>“{hold.reason}”</p>
          </>
        )}
      />
    </div>
  );
}
