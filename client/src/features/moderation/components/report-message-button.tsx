import { useState } from 'react';
import { REASON_MAX } from '@shared/moderation-limits';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { cx } from '../../../components/ui/cx';
import { isApiError } from '../../../lib/api-client';
import { ConfirmDialog } from '../../steward/components/confirm-dialog';
import { TextAreaField } from '../../steward/components/form-controls';
import { useReportMessage } from '../api/report-message';

/**
 * "Report this message" for a thread: asks for a reason, sends it to the stewards, and says so.
 * For text and aside messages that are not hidden; the thread decides where it sits.
 */
export function ReportMessageButton({ messageId, authorName, className }: { messageId: number; authorName?: string; className?: string }) {
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [problem, setProblem] = useState<string | undefined>();
  const [sent, setSent] = useState(false);
  const report = useReportMessage();

  const send = async () => {
    // zod comes only when a report is sent: the thread shows this button on every message.
    const { reportMessageSchema } = await import('@shared/steward-schemas');
    const parsed = reportMessageSchema.safeParse({ reason });
    if (!parsed.success) {
      setProblem(parsed.error.issues[0]?.message);
      return;
    }
    setProblem(undefined);
    report.mutate(
      { messageId, reason: parsed.data.reason },
      {
        onSuccess: () => {
          setSent(true);
          setOpen(false);
        },
        onError: (error) => setProblem(isApiError(error) ? error.fields?.reason : undefined),
      },
    );
  };

  if (sent) {
    return (
      <p role="status" className={cx('text-sm text-loam-soft', className)}>
        Reported — a steward will look at it.
      </p>
    );
  }

  return (
    <>
      <Button variant="quiet" className={cx('min-h-11 px-2 text-sm', className)} onClick={() => setOpen(true)}>
        Report<span className="sr-only"> this message{authorName ? ` by ${authorName}` : ''}</span>
      </Button>
      <ConfirmDialog
        open={open}
        title="Report this message to the stewards"
        confirmLabel="Send the report"
        busy={report.isPending}
        onConfirm={() => void send()}
        onCancel={() => {
          setOpen(false);
          setProblem(undefined);
          report.reset();
        }}
      >
        <p>A steward reads it and may hide the message for everyone. The person who wrote it is not told who reported it.</p>
        <TextAreaField label="What is wrong with it?" value={reason} maxLength={REASON_MAX} rows={3} onChange={(e) => setReason(e.target.value)} error={problem} />
        {report.isError && !(isApiError(report.error) && report.error.fields?.reason) && (
          <Alert tone="danger" title="The report was not sent">
            {report.error.message}
          </Alert>
        )}
      </ConfirmDialog>
    </>
  );
}
