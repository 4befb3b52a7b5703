// Curating the Field Library, for stewards on a field note's page: take the note out, saying
// why. The case keeps everything; its thread and the audit log record the reason, and a steward
// can put the note back from the case page. Loaded only for stewards (the page is public).
import { useId, useState } from 'react';
import { Link } from 'react-router';
import { LIBRARY_HOLD_REASON_MAX } from '@shared/moderation-limits';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { ReasonDialog } from '../../steward/components/reason-dialog';
import { useTakeDownNote } from '../api/take-down-note';

export function TakeDownPanel({ slug }: { slug: string }) {
  const headingId = useId();
  const [open, setOpen] = useState(false);
  const takeDown = useTakeDownNote(slug);

  if (takeDown.isSuccess) {
    const state = takeDown.data;
    return (
      <Alert tone="warning" title="This note is out of the Field Library">
        Visitors and growers no longer find it, here or among their batches like this. The case’s thread says why.{' '}
        <Link to={`/cases/${state.caseId}`}>Open the case</Link> to put it back later, or go <Link to="/library">back to the Field Library</Link>.
      </Alert>
    );
  }

  return (
    <section aria-labelledby={headingId} className="flex flex-col gap-3 rounded-soft border-2 border-dashed border-loam-soft p-4 sm:p-5">
      <h2 id={headingId} className="text-xl font-extrabold">
        For stewards
      </h2>
      <p className="text-base">
        If this note names a person or a place, or its advice is not safe to copy, take it out of the library. The case keeps everything, and a
        steward can put it back from the case page.
      </p>
      <Button variant="secondary" className="self-start" onClick={() => setOpen(true)}>
        Take it out of the library
      </Button>
      <ReasonDialog
        open={open}
        title="Take this note out of the Field Library"
        label="Why does it come out?"
        maxLength={LIBRARY_HOLD_REASON_MAX}
        confirmLabel="Take it out"
        confirmVariant="danger"
        loadSchema={() => import('@shared/closing-schemas').then((m) => m.takeDownSchema)}
        busy={takeDown.isPending}
        error={takeDown.error}
        failedTitle="The note is still in the library"
        onSend={(reason) => takeDown.mutate(reason, { onSuccess: () => setOpen(false) })}
        onCancel={() => {
          setOpen(false);
          takeDown.reset();
        }}
      >
        <p>The grower and the mentor see your reason in the case’s thread; it also goes into the audit log.</p>
      </ReasonDialog>
    </section>
  );
}
