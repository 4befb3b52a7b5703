import { useEffect, useId, useRef, type ReactNode } from 'react';
import { Button, type ButtonVariant } from '../../../components/ui/button';

/**
 * A modal question before a change that is hard to take back. The native <dialog> keeps focus
 * inside, closes on Escape, and returns focus to the button that opened it.
 */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  confirmVariant = 'primary',
  busy = false,
  onConfirm,
  onCancel,
}: {
  open: boolean;
  title: string;
  children?: ReactNode;
  confirmLabel: string;
  confirmVariant?: ButtonVariant;
  busy?: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const headingId = useId();
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={headingId}
      onCancel={(event) => {
        event.preventDefault();
        if (!busy) onCancel();
      }}
      className="m-auto w-[min(100%-2rem,32rem)] rounded-soft border-2 border-loam-soft bg-rice p-0 text-loam backdrop:bg-loam/60"
    >
      <div className="p-5 sm:p-6">
        <h2 id={headingId} className="text-xl font-extrabold">
          {title}
        </h2>
        {children && <div className="mt-3 flex flex-col gap-3">{children}</div>}
        <div className="mt-5 flex flex-wrap justify-end gap-3">
          <Button variant="secondary" onClick={onCancel} disabled={busy}>
            Cancel
          </Button>
          <Button variant={confirmVariant} onClick={onConfirm} disabled={busy}>
            {busy ? 'Working…' : confirmLabel}
          </Button>
        </div>
      </div>
    </dialog>
  );
}

