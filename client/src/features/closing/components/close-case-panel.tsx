import { lazy, Suspense, useEffect, useId, useRef, useState } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClosingState } from '@shared/closing-schemas';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Spinner } from '../../../components/ui/spinner';
import { api } from '../../../lib/api-client';
import { useClosing } from '../api/get-closing';
import { refreshAfterClosing } from '../api/refresh-after-closing';
import { ClosingRecord } from './closing-record';

// The form (with the form library and zod) is fetched when someone opens it: everyone who reads a
// case loads this panel, and most of them (the grower, other mentors) never close it.
const loadForm = () => import('./close-case-form');
const CloseCaseForm = lazy(() => loadForm().then((m) => ({ default: m.CloseCaseForm })));

/**
 * On the case page: for the mentor holding the case (or a steward) while it is open, closing it
 * with a cause, a remedy and a summary (PRODUCT.md screen 6); once closed, what closing recorded,
 * for everyone who reads the case. A steward may close a long-silent watching case as lost.
 */
export function CloseCasePanel({ caseId }: { caseId: number }) {
  const closing = useClosing(caseId);
  const headingId = useId();
  // Still true once the form's own closing went through, which is when to say so.
  const [open, setOpen] = useState(false);
  const openButtonRef = useRef<HTMLButtonElement>(null);
  const doneRef = useRef<HTMLDivElement>(null);
  // "Not yet" takes the form away: focus goes back to the button that opened it.
  const [backToButton, setBackToButton] = useState(false);
  const state = closing.data;
  const closed = !!state && state.closedAt !== null && state.status !== 'withdrawn';
  const justClosed = open && closed;

  useEffect(() => {
    if (!backToButton) return;
    openButtonRef.current?.focus();
    setBackToButton(false);
  }, [backToButton]);
  // The form and its button are gone once the case is closed; focus goes to the news instead of
  // falling back to the top of the page.
  useEffect(() => {
    if (justClosed) doneRef.current?.focus();
  }, [justClosed]);

  if (!state) return null;
  if (!state.can.close && !closed) return null;

  return (
    <section aria-labelledby={headingId} className="flex flex-col gap-4 rounded-soft border-2 border-moss bg-moss-mist/40 p-4 sm:p-6">
      <h2 id={headingId} className="text-2xl font-extrabold">
        {closed ? 'Closing' : 'Close this case'}
      </h2>
      {justClosed && (
        <Alert ref={doneRef} tabIndex={-1} tone="success" title="Closed: the case is now watching">
          The grower has an e-mail with your summary and a link to tell us how the batch does.
        </Alert>
      )}
      {!closed && !open && (
        <div className="flex flex-col gap-3">
          <p>When there is a likely cause and a remedy to try, record them here. The grower then tells us how the batch does.</p>
          {/* Fetched as soon as a pointer or the keyboard reaches the button, so it is usually here by the click. */}
          <Button ref={openButtonRef} className="self-start" onPointerEnter={() => void loadForm()} onFocus={() => void loadForm()} onClick={() => setOpen(true)}>
            Close the case…
          </Button>
        </div>
      )}
      {!closed && open && (
        <Suspense fallback={<Spinner label="Opening the form…" />}>
          <CloseCaseForm
            caseId={caseId}
            onCancel={() => {
              setOpen(false);
              setBackToButton(true);
            }}
          />
        </Suspense>
      )}
      {closed && <ClosingRecord state={state} />}
      {state.libraryHold && state.can.publish && <PutBack state={state} />}
      {state.can.closeAsLost && <CloseAsLost state={state} />}
    </section>
  );
}

/** A steward lifts a hold: the field note goes back into the Field Library. */
function PutBack({ state }: { state: ClosingState }) {
  const queryClient = useQueryClient();
  const mutation = useMutation({
    mutationFn: () => api.post<ClosingState>(`/api/cases/${state.caseId}/publish`, {}),
    onSuccess: (next) => refreshAfterClosing(queryClient, next),
  });
  return (
    <div className="flex flex-col gap-2 border-t border-line pt-3">
      <p>The grower still agrees to share this case. When what was wrong with the note is settled, put it back.</p>
      <Button variant="secondary" className="self-start" onClick={() => mutation.mutate()} disabled={mutation.isPending}>
        {mutation.isPending ? 'Putting it back…' : 'Put it back in the Field Library'}
      </Button>
      {mutation.error && (
        <p role="alert" className="font-semibold text-ember">
          {mutation.error.message}
        </p>
      )}
    </div>
  );
}

function CloseAsLost({ state }: { state: ClosingState }) {
  const queryClient = useQueryClient();
  const [confirm, setConfirm] = useState(false);
  const mutation = useMutation({
    mutationFn: () => api.post<ClosingState>(`/api/cases/${state.caseId}/close-as-lost`, {}),
    onSuccess: (next) => refreshAfterClosing(queryClient, next),
  });
  return (
    <div className="flex flex-col gap-2 border-t border-line pt-3">
      <p>No recovery report came in 14 days after closing. As a steward you may close the case as lost; it then counts in no track record.</p>
      {!confirm ? (
        <Button variant="secondary" className="self-start" onClick={() => setConfirm(true)}>
          Close as lost…
        </Button>
      ) : (
        <div className="flex flex-wrap gap-3">
          <Button variant="danger" onClick={() => mutation.mutate()} disabled={mutation.isPending}>
            {mutation.isPending ? 'Closing…' : 'Yes, close it as lost'}
          </Button>
          <Button variant="secondary" onClick={() => setConfirm(false)}>
            Keep watching
          </Button>
        </div>
      )}
      {mutation.error && (
        <p role="alert" className="font-semibold text-ember">
          {mutation.error.message}
        </p>
      )}
    </div>
  );
}
