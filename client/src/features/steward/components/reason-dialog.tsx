import { useState, type ReactNode } from 'react';
import type { ZodType } from 'zod';
import { Alert } from '../../../components/ui/alert';
import type { ButtonVariant } from '../../../components/ui/button';
import { isApiError } from '../../../lib/api-client';
import { ConfirmDialog } from './confirm-dialog';
import { TextAreaField } from './form-controls';

/**
 * A ConfirmDialog that asks why (reporting a message, taking a field note out of the library):
 * one reason box, checked with the route's own schema before it is sent, then with the server's
 * answer. The schema is fetched only when a reason is sent, so the pages that show the button do
 * not load zod.
 */
export function ReasonDialog({
  open,
  title,
  children,
  label,
  maxLength,
  confirmLabel,
  confirmVariant,
  loadSchema,
  busy,
  error,
  failedTitle,
  onSend,
  onCancel,
}: {
  open: boolean;
  title: string;
  children?: ReactNode;
  label: string;
  maxLength: number;
  confirmLabel: string;
  confirmVariant?: ButtonVariant;
  loadSchema: () => Promise<ZodType<{ reason: string }>>;
  busy: boolean;
  /** The last send's failure: a problem with the reason shows at the box, anything else below it. */
  error: Error | null;
  failedTitle: string;
  onSend: (reason: string) => void;
  onCancel: () => void;
}) {
  const [reason, setReason] = useState('');
  const [problem, setProblem] = useState<string | undefined>();
  const refused = isApiError(error) ? error.fields?.reason : undefined;

  const send = async () => {
    const parsed = (await loadSchema()).safeParse({ reason });
    if (!parsed.success) {
      setProblem(parsed.error.issues[0]?.message);
      return;
    }
    setProblem(undefined);
    onSend(parsed.data.reason);
  };

  return (
    <ConfirmDialog
      open={open}
      title={title}
      confirmLabel={confirmLabel}
      confirmVariant={confirmVariant}
      busy={busy}
      onConfirm={() => void send()}
      onCancel={() => {
        setProblem(undefined);
        onCancel();
      }}
    >
      {children}
      <TextAreaField label={label} value={reason} maxLength={maxLength} rows={3} onChange={(e) => setReason(e.target.value)} error={problem ?? refused} />
      {error && !refused && (
        <Alert tone="danger" title={failedTitle}>
          {error.message}
        </Alert>
      )}
    </ConfirmDialog>
  );
}
