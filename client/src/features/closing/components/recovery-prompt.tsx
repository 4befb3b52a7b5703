import { useId } from 'react';
import { Link } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { Button, buttonClasses } from '../../../components/ui/button';
import { useChangeConsent } from '../api/change-consent';
import { useClosing } from '../api/get-closing';
import { LibraryHoldText } from './closing-record';

/**
 * On the case page, for its grower: while the case is watching, the way to the recovery report;
 * once it ended, whether it is shared as a field note, with the choice to change that.
 */
export function RecoveryPrompt({ caseId }: { caseId: number }) {
  const closing = useClosing(caseId);
  const consent = useChangeConsent(caseId);
  const headingId = useId();
  const state = closing.data;
  if (!state) return null;

  if (state.can.fileReport) {
    return (
      <section aria-labelledby={headingId} className="flex flex-col gap-3 rounded-soft border-2 border-clay bg-clay-mist p-4 sm:p-5">
        <h2 id={headingId} className="text-xl font-extrabold text-clay-deep">
          How is the batch doing?
        </h2>
        <p>
          {state.closedBy?.displayName ?? 'Your mentor'} closed this case with a remedy to try. When you can tell whether it worked, let us know:
          it takes a minute, and it is how the next grower learns what works.
        </p>
        <Link to={`/cases/${caseId}/recovery-report`} className={buttonClasses('primary', 'self-start')}>
          File the recovery report
        </Link>
      </section>
    );
  }

  if (!state.can.changeConsent) return null;
  const toggle = () => consent.mutate({ consentToPublish: !state.consentToPublish });
  return (
    <section aria-labelledby={headingId} className="flex flex-col gap-3 rounded-soft border border-line bg-rice-deep p-4 sm:p-5">
      <h2 id={headingId} className="text-xl font-extrabold">
        Sharing this case
      </h2>
      {state.libraryHold ? (
        <LibraryHoldText hold={state.libraryHold} consentToPublish={state.consentToPublish} reader="grower" />
      ) : state.published && state.noteSlug ? (
        <p>
          This case is in the Field Library as an anonymised field note: <Link to={`/library/${state.noteSlug}`}>read it</Link>. You can stop
          sharing it at any time.
        </p>
      ) : (
        <p>This case is not shared. If you agree, it becomes a field note in the Field Library without your name, e-mail or place.</p>
      )}
      <Button variant={state.consentToPublish ? 'secondary' : 'primary'} className="self-start" onClick={toggle} disabled={consent.isPending}>
        {consent.isPending ? 'Saving…' : state.consentToPublish ? 'Stop sharing it' : 'Share it as a field note'}
      </Button>
      {consent.error && (
        <Alert tone="danger" title="That did not go through">
          {consent.error.message}
        </Alert>
      )}
    </section>
  );
}
