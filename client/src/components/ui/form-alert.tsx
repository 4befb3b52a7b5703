import { useEffect, useRef } from 'react';
import { Alert } from './alert';

/** A form-level failure. It takes focus when it appears so keyboard and screen-reader users
 * land on the reason the form did not go through. */
export function FormAlert({ title, message }: { title: string; message: string | null }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (message) ref.current?.focus();
  }, [message]);
  if (!message) return null;
  return (
    <Alert ref={ref} tabIndex={-1} tone="danger" title={title}>
      {message}
    </Alert>
  );
}
