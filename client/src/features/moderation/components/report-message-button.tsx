import { useState } from 'react';
import { REASON_MAX } from '@shared/moderation-limits';
import { Button } from '../../../components/ui/button';
import { cx } from '../../../components/ui/cx';
import { ReasonDialog } from '../../steward/components/reason-dialog';
import { useReportMessage } from '../api/report-message';

/**
 * "Report this message" for a thread: asks for a reason, sends it to the stewards, and says so.
 * For text and aside messages that are not hidden; the thread decides where it sits.
 */
export function ReportMessageButton({ messageId, authorName, className }: { messageId: number; authorName?: string; className?: string }) {
  const [open, setOpen] = useState(false);
  const [sent, setSent] = useState(false);
  const report = useReportMessage();

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
      <ReasonDialog
        open={open}
        title="Report this message to the stewards"
        label="What is wrong with it?"
        maxLength={REASON_MAX}
        confirmLabel="Send the report"
        // zod comes only when a report is sent: the thread shows this button on every message.
        loadSchema={() => import('@shared/steward-schemas').then((m) => m.reportMessageSchema)}
        busy={report.isPending}
        error={report.error}
        failedTitle="The report was not sent"
        onSend={(reason) =>
          report.mutate(
            { messageId, reason },
            {
              onSuccess: () => {
                setSent(true);
                setOpen(false);
              },
            },
          )
        }
        onCancel={() => {
          setOpen(false);
          report.reset();
        }}
      >
        <p>A steward reads it and may hide the message for everyone. The person who wrote it is not told who reported it.</p>
      </ReasonDialog>
    </>
  );
}
