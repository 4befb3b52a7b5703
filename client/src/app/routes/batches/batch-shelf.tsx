import type { QueryClient } from '@tanstack/react-query';
import { Link } from 'react-router';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { Alert } from '../../../components/ui/alert';
import { buttonClasses } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { Spinner } from '../../../components/ui/spinner';
import { ConfirmEmailNotice } from '../../../features/auth/components/confirm-email-notice';
import { batchesQueryOptions, useBatches } from '../../../features/batches/api/get-batches';
import { BatchShelfTable } from '../../../features/batches/components/batch-shelf-table';
import { MyCasesList } from '../../../features/cases/components/my-cases-list';

export const clientLoader = (queryClient: QueryClient) => async () => {
  // Warm the cache without failing the page: the page shows its own error with a way to retry.
  await queryClient.prefetchQuery(batchesQueryOptions());
  return null;
};

export default function BatchShelfRoute() {
  const batches = useBatches();

  return (
    <ContentLayout
      title="Batch shelf"
      lead="Every batch you are making or keeping, with its age and a quick sugar check. Open a case from any of them when it starts to go wrong."
    >
      <ConfirmEmailNotice className="mb-6" />
      <div className="mb-6 flex flex-wrap gap-3">
        <Link to="/batches/new" className={buttonClasses('primary')}>
          Add a batch
        </Link>
        <Link to="/cases/new" className={buttonClasses('secondary')}>
          Open a case without a batch
        </Link>
      </div>
      {batches.isPending ? (
        <Spinner label="Fetching your batches…" />
      ) : batches.isError ? (
        <Alert tone="danger" title="Your batches could not be shown">
          <p>{batches.error.message}</p>
          <button type="button" className="mt-2 font-bold underline" onClick={() => void batches.refetch()}>
            Try again
          </button>
        </Alert>
      ) : batches.data.items.length === 0 ? (
        <EmptyShelf />
      ) : (
        <BatchShelfTable batches={batches.data.items} />
      )}
      <section aria-labelledby="my-cases-heading" className="mt-12">
        <h2 id="my-cases-heading" className="mb-4 text-2xl font-extrabold">
          Your cases
        </h2>
        <MyCasesList />
      </section>
    </ContentLayout>
  );
}

function EmptyShelf() {
  return (
    <Card className="max-w-2xl">
      <h2 className="text-xl font-extrabold">Your shelf is empty</h2>
      <p className="mt-2">
        A batch is one jar, crock or box of a living input you are making: an IMO rice culture, a plant or fruit juice, a LAB
        serum and so on. Write down its stage, the day you made it and its weights, and Sporewell works out its sugar check,
        prints a jar label with a QR code, and fills in the numbers for you if you ever need to open a case about it.
      </p>
      <Link to="/batches/new" className={buttonClasses('primary', 'mt-4')}>
        Add a batch
      </Link>
    </Card>
  );
}
