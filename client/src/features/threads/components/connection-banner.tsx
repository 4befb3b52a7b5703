import { useEffect, useRef, useState } from 'react';
import { cx } from '../../../components/ui/cx';
import { useConnectionState } from '../../../lib/socket';

const BACK_NOTICE_MS = 5_000;

/** Says so plainly when the live connection drops, and again when it is back. Nothing is shown
 * while all is well, or while the first connection is still being made. */
export function ConnectionBanner({
  className,
  offlineText = 'Messages you write will send when the connection is back. New replies will show up then too.',
  backText = 'The thread is up to date.',
}: {
  className?: string;
  offlineText?: string;
  backText?: string;
}) {
  const state = useConnectionState();
  const wasOffline = useRef(false);
  const [back, setBack] = useState(false);

  useEffect(() => {
    if (state === 'offline') {
      wasOffline.current = true;
      setBack(false);
      return;
    }
    if (state === 'online' && wasOffline.current) {
      wasOffline.current = false;
      setBack(true);
      const timer = setTimeout(() => setBack(false), BACK_NOTICE_MS);
      return () => clearTimeout(timer);
    }
  }, [state]);

  // Always in the page, so screen readers hear the change (a live region must exist first).
  return (
    <div role="status" aria-live="polite" className={className}>
      {state === 'offline' && (
        <p className="flex items-start gap-3 rounded-soft border-l-8 border-clay bg-clay-mist px-4 py-3">
          <Dot className="mt-2 bg-clay" />
          <span>
            <strong className="block font-extrabold text-clay-deep">You are offline</strong>
            {offlineText}
          </span>
        </p>
      )}
      {state === 'online' && back && (
        <p className="flex items-start gap-3 rounded-soft border-l-8 border-moss bg-moss-mist px-4 py-3">
          <Dot className="mt-2 bg-moss" />
          <span>
            <strong className="font-extrabold text-moss-deep">Back online.</strong> {backText}
          </span>
        </p>
      )}
    </div>
  );
}

function Dot({ className }: { className?: string }) {
  return <span aria-hidden="true" className={cx('inline-block size-3 shrink-0 rounded-full', className)} />;
}
