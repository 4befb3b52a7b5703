// On a batch's page: take it off the shelf when it is used up or thrown out (it leaves the shelf
// and the list "Open a case" offers), or put it back. Nothing is deleted either way.
import { Link } from 'react-router';
import type { BatchView } from '@shared/case-schemas';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { useUpdateBatch } from '../api/update-batch';
import { formatMadeOn, todayIso } from '../lib/batch-format';
import { OFF_SHELF_PATH } from '../lib/off-shelf';

export function OffShelfControl({ batch }: { batch: BatchView }) {
  const update = useUpdateBatch(batch.id);
  const off = batch.finishedOn !== null;

  return (
    <section aria-labelledby="off-shelf-heading">
      <h2 id="off-shelf-heading" className="text-xl font-extrabold">
        {off ? 'Off the shelf' : 'Finished with it?'}
      </h2>
      {off ? (
        <p className="mt-2">
          You took this batch off the shelf on {formatMadeOn(batch.finishedOn!)}. It is kept with its cases and its jar label, under{' '}
          <Link to={OFF_SHELF_PATH}>batches taken off the shelf</Link>.
        </p>
      ) : (
        <p className="mt-2">
          Used up on the beds, or thrown out? Take it off the shelf: it leaves your shelf and the list of batches a new case offers, and it is
          kept with its cases. You can put it back.
        </p>
      )}
      {update.isError && (
        <Alert tone="danger" title="That did not go through" className="mt-3">
          {update.error.message}
        </Alert>
      )}
      <Button variant="secondary" className="mt-3" disabled={update.isPending} onClick={() => update.mutate({ finishedOn: off ? null : todayIso() })}>
        {update.isPending ? 'Saving…' : off ? 'Put it back on the shelf' : 'Take it off the shelf'}
      </Button>
      <p role="status" className="mt-2 font-bold text-moss-deep empty:hidden">
        {update.isSuccess ? (update.data.finishedOn ? 'Taken off the shelf.' : 'Back on the shelf.') : ''}
      </p>
    </section>
  );
}
