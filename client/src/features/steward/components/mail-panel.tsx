import { useState } from 'react';
import { useCaughtMail } from '../api/get-mail';
import { formatDateTime } from '../lib/dates';
import { PagedList } from './paged-list';

/** The e-mails the local mail catcher received (only while no real mail server is set up). */
export function MailPanel() {
  const [page, setPage] = useState(1);
  const mail = useCaughtMail(page);
  return (
    <div>
      <p className="mb-4 max-w-prose text-loam-soft">
        Sporewell is running without a mail server, so the e-mails it sends are caught here instead of delivered. Open one to read it.
      </p>
      <PagedList
        query={mail}
        loadingLabel="Opening the mailbox…"
        errorTitle="The caught mail could not be loaded"
        empty="No e-mail has been sent yet."
        page={page}
        onPage={setPage}
        pagerLabel="Pages of caught mail"
        className="flex flex-col gap-3"
        renderItem={(m) => (
          <details className="rounded-soft border border-line bg-rice">
            <summary className="flex min-h-11 cursor-pointer flex-col gap-0.5 p-4 sm:flex-row sm:items-baseline sm:gap-4">
              <span className="font-extrabold">{m.subject || '(no subject)'}</span>
              <span className="text-loam-soft">
                to {m.to} · <time dateTime={m.receivedAt}>{formatDateTime(m.receivedAt)}</time>
              </span>
            </summary>
            <pre className="overflow-x-auto whitespace-pre-wrap break-words border-t border-line px-4 py-3 font-sans text-base">{m.text ?? ''}</pre>
          </details>
        )}
      />
    </div>
  );
}
