import type { ReactNode } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { Alert } from '../../../components/ui/alert';
import { buttonClasses } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { Spinner } from '../../../components/ui/spinner';
import { ConfirmEmailNotice } from '../../../features/auth/components/confirm-email-notice';
import { batchesQueryOptions, useBatches } from '../../../features/batches/api/get-batches';
import { BatchShelfTable } from '../../../features/batches/components/batch-shelf-table';
import { OFF_SHELF_PATH, offShelfOf } from '../../../features/batches/lib/off-shelf';
import { MyCasesList } from '../../../features/cases/components/my-cases-list';


export const clientLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  // Warm the cache without failing the page: the page shows its own error with a way to retry.
  await queryClient.prefetchQuery(batchesQueryOptions(offShelfOf(new URL(request.url).searchParams)));
  return null;
};

export default function BatchShelfRoute() {
  const [params] = useSearchParams();
  const offShelf = offShelfOf(params);
  const batches = useBatches(offShelf);
  const counts = batches.data?.counts;

  if (offShelf) {
    return (
      <ContentLayout
        title="Taken off the shelf"
        lead="Batches you have finished with: used up on the beds or thrown out. Their cases and jar labels are kept; put one back on the shelf if you took it off by mistake."
      >
        <Link to="/batches" className={buttonClasses('secondary', 'mb-6')}>
          ← Back to the batch shelf
        </Link>
        <ShelfList batches={batches} empty={<p className="text-loam-soft">Nothing here: every batch you recorded is still on the shelf.</p>} />
      </ContentLayout>
    );
  }

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
      <ShelfList batches={batches} empty={<EmptyShelf />} />
      {counts && counts.finished > 0 && (
        <p className="mt-4">
          <Link to={OFF_SHELF_PATH}>
            {counts.finished === 1 ? '1 batch' : `${counts.finished} batches`} taken off the shelf
          </Link>
          <span className="text-loam-soft"> — used up or thrown out</span>
        </p>
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

/** The batches of one side of the shelf once they are in, or why they are not. */
function ShelfList({ batches, empty }: { batches: ReturnType<typeof useBatches>; empty: ReactNode }) {
  if (batches.isPending) return <Spinner label="Fetching your batches…" />;
  if (batches.isError) {
    return (
      <Alert tone="danger" title="Your batches could not be shown">
        <p>{batches.error.message}</p>
        <button type="button" className="mt-2 font-bold underline" onClick={() => void batches.refetch()}>
          Try again
        </button>
      </Alert>
    );
  }
  return batches.data.items.length === 0 ? empty : <BatchShelfTable batches={batches.data.items} />;
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
