import { useState } from 'react';
import { Link } from 'react-router';
import { REPORT_STATUSES, type MessageReport, type ReportStatus } from '@shared/steward-schemas';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { ROLE_LABELS } from '../../../lib/auth';
import { ConfirmDialog } from '../../steward/components/confirm-dialog';
import { TextAreaField } from '../../steward/components/form-controls';
import { DoneNotice, PagedList, StatusSelect, useStatusPages } from '../../steward/components/paged-list';
import { formatDateTime } from '../../steward/lib/dates';
import { useReports } from '../api/get-reports';
import { useDismissReport } from '../api/dismiss-report';
import { useHideMessage } from '../api/hide-message';
import { useShowMessage } from '../api/show-message';

const STATUS_WORDS: Record<ReportStatus, string> = {
  open: 'Waiting for a steward',
  hidden: 'Settled: message hidden',
  dismissed: 'Dismissed',
};

const STATUS_OPTIONS = REPORT_STATUSES.map((s) => ({ value: s, label: STATUS_WORDS[s] }));

export function ReportsPanel() {
  const { status, setStatus, page, setPage, done, setDone } = useStatusPages<ReportStatus>('open');
  const reports = useReports({ status, page });

  return (
    <div>
      <StatusSelect value={status} options={STATUS_OPTIONS} onChange={setStatus} />
      <DoneNotice message={done} />
      <PagedList
        query={reports}
        loadingLabel="Loading reports…"
        errorTitle="The reports could not be loaded"
        empty={status === 'open' ? 'No report is waiting. When someone reports a message in a thread, it appears here.' : 'None yet.'}
        page={page}
        onPage={setPage}
        pagerLabel="Pages of reports"
        renderItem={(report) => <ReportCard report={report} onDone={setDone} />}
      />
    </div>
  );
}

function ReportCard({ report, onDone }: { report: MessageReport; onDone: (message: string) => void }) {
  const [asking, setAsking] = useState<'hide' | 'dismiss' | 'show' | null>(null);
  const [note, setNote] = useState('');
  const hide = useHideMessage();
  const dismiss = useDismissReport();
  const show = useShowMessage();
  const busy = hide.isPending || dismiss.isPending || show.isPending;
  const error = hide.error ?? dismiss.error ?? show.error;
  const m = report.message;
  const author = m.author ? `${m.author.displayName} (${ROLE_LABELS[m.author.role].toLowerCase()})` : 'someone who has left';
  const headingId = `report-${report.id}`;

  const close = () => {
    setAsking(null);
    setNote('');
    hide.reset();
    dismiss.reset();
    show.reset();
  };
  // mutateAsync: a settled report leaves the open list and this card unmounts, which would drop
  // mutate's per-call callbacks.
  const confirm = () => {
    const done =
      asking === 'hide'
        ? hide.mutateAsync({ messageId: m.id, note }).then(() => `The message by ${author} is hidden for everyone. Its text stays in the audit log.`)
        : asking === 'show'
          ? show.mutateAsync({ messageId: m.id, note }).then(() => `The message by ${author} shows in its thread again.`)
          : dismiss.mutateAsync({ reportId: report.id, note }).then(() => 'The report is dismissed; the message stays as it was.');
    done.then((message) => {
      close();
      onDone(message);
    }, () => undefined); // shown from the mutation's error
  };

  return (
    <Card className="bg-rice" role="group" aria-labelledby={headingId}>
      <h3 id={headingId} className="text-lg font-extrabold">
        In <Link to={`/cases/${m.caseId}`}>{m.caseTitle}</Link>
      </h3>
      <p className="text-loam-soft">
        {author} wrote{m.kind === 'aside' ? ' (a mentor aside)' : ''} on {formatDateTime(m.createdAt)}
        {m.hidden ? ' — now hidden' : report.status === 'hidden' ? ' — hidden, then shown again' : ''}:
      </p>
      <blockquote className="mt-2 whitespace-pre-wrap rounded-soft border-l-4 border-ember bg-rice-deep px-4 py-3">{m.body}</blockquote>
      <p className="mt-3">
        <span className="font-bold">Reported by {report.reporter?.displayName ?? 'someone who has left'}</span>, {formatDateTime(report.createdAt)}: “{report.reason}”
      </p>
      {m.openReports > 1 && report.status === 'open' && <p className="text-loam-soft">{m.openReports} open reports about this message.</p>}

      {report.status === 'open' ? (
        <div className="mt-4 flex flex-wrap gap-3">
          {!m.hidden && (
            <Button variant="danger" onClick={() => setAsking('hide')}>
              Hide the message
            </Button>
          )}
          <Button variant="secondary" onClick={() => setAsking('dismiss')}>
            Dismiss the report
          </Button>
        </div>
      ) : (
        <>
          <p className="mt-4 rounded-soft bg-rice-deep px-3 py-2">
            <span className="font-bold">{STATUS_WORDS[report.status]}</span>
            {report.decidedBy && ` by ${report.decidedBy.displayName}`}
            {report.decidedAt && ` on ${formatDateTime(report.decidedAt)}`}
          </p>
          {m.hidden && (
            <Button variant="secondary" className="mt-3" onClick={() => setAsking('show')}>
              Show the message again
            </Button>
          )}
        </>
      )}

      <ConfirmDialog
        open={asking !== null}
        busy={busy}
        title={asking === 'hide' ? 'Hide this message for everyone?' : asking === 'show' ? 'Show this message again?' : 'Dismiss this report?'}
        confirmLabel={asking === 'hide' ? 'Hide the message' : asking === 'show' ? 'Show the message again' : 'Dismiss the report'}
        confirmVariant={asking === 'hide' ? 'danger' : 'primary'}
        onConfirm={confirm}
        onCancel={close}
      >
        <p>
          {asking === 'hide'
            ? 'Everyone in the thread sees “Hidden by a steward” in its place, at once. The text is kept in the audit log.'
            : asking === 'show'
              ? 'Everyone in the thread sees its text again, at once. The reports about it stay settled, and the audit log keeps both steps.'
              : 'The message stays as it is. The person who reported it is not told.'}
        </p>
        <TextAreaField label="Note for the audit log (optional)" value={note} rows={2} maxLength={1000} onChange={(e) => setNote(e.target.value)} />
        {error && (
          <Alert tone="danger" title="That did not go through">
            {error.message}
          </Alert>
        )}
      </ConfirmDialog>
    </Card>
  );
}
