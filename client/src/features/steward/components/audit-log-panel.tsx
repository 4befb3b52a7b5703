import { useState } from 'react';
import { useAudit } from '../api/get-audit';
import { describeAudit } from '../lib/audit-words';
import { formatDateTime } from '../lib/dates';
import { PagedList } from './paged-list';

export function AuditLogPanel() {
  const [page, setPage] = useState(1);
  const audit = useAudit(page);
  return (
    <div>
      <p className="mb-4 max-w-prose text-loam-soft">
        Every change made on this desk, and every report and application, newest first. Hidden messages keep their text here.
      </p>
      <PagedList
        query={audit}
        loadingLabel="Reading the log…"
        errorTitle="The audit log could not be loaded"
        empty="Nothing has been recorded yet."
        page={page}
        onPage={setPage}
        pagerLabel="Pages of the audit log"
        ordered
        className="flex flex-col divide-y divide-line rounded-soft border border-line bg-rice"
        itemClassName="flex flex-col gap-1 p-4 sm:flex-row sm:gap-4"
        renderItem={(entry) => (
          <>
            <time dateTime={entry.createdAt} className="shrink-0 text-base text-loam-soft tabular-nums sm:w-44">
              {formatDateTime(entry.createdAt)}
            </time>
            <div className="min-w-0">
              <p>
                <span className="font-extrabold">{entry.actor?.displayName ?? 'Sporewell'}</span> {describeAudit(entry)}
              </p>
              {entry.action === 'message.hidden' && typeof entry.detail.body === 'string' && (
                <details className="mt-1">
                  <summary className="inline-flex min-h-11 cursor-pointer items-center font-bold text-moss-deep underline underline-offset-4">The hidden text</summary>
                  <blockquote className="mt-1 whitespace-pre-wrap border-l-4 border-line pl-3 text-loam-soft">{entry.detail.body}</blockquote>
                </details>
              )}
            </div>
          </>
        )}
      />
    </div>
  );
}
