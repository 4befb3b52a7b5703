// The rounds (PRODUCT.md screen 5): the cases that need a mentor, most urgent first.
//
// Kept current two ways: the server tells every mentor's socket when a case changes
// (`case:updated` in the staff room) and the list refetches at once; and it polls every 30 s
// regardless, because waiting hours climb and new cases arrive without any such event.
import { useEffect, useRef } from 'react';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { Alert } from '../../../components/ui/alert';
import { Button, buttonClasses } from '../../../components/ui/button';
import { cx } from '../../../components/ui/cx';
import { Spinner } from '../../../components/ui/spinner';
import { useLiveSocket } from '../../../lib/socket';
import { useUser } from '../../../features/auth/api/get-me';
import { roundsKeys } from '../../../features/rounds/api/rounds-keys';
import { roundsQueryOptions, useRounds } from '../../../features/rounds/api/get-rounds';
import { RoundsFiltersForm } from '../../../features/rounds/components/rounds-filters-form';
import { RoundsTable } from '../../../features/rounds/components/rounds-table';
import { MailSettings } from '../../../features/rounds/components/mail-settings';
import { filtersFromSearch, searchFromFilters, type RoundsFilters } from '../../../features/rounds/lib/rounds-filters';
import { ConnectionBanner } from '../../../features/threads/components/connection-banner';

export function clientLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    const filters = filtersFromSearch(new URL(request.url).searchParams);
    // Warm, but do not hold the page on a slow list: the page shows its own loading state.
    void queryClient.prefetchQuery(roundsQueryOptions(filters));
    return null;
  };
}

/** One refetch for a burst of hints (a busy evening can bring several a second). */
function useLiveRounds(): void {
  const socket = useLiveSocket();
  const queryClient = useQueryClient();
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  useEffect(() => {
    if (!socket) return;
    const refresh = () => {
      if (timer.current) return;
      timer.current = setTimeout(() => {
        timer.current = null;
        void queryClient.invalidateQueries({ queryKey: roundsKeys.lists() });
      }, 800);
    };
    socket.on('case:updated', refresh);
    // A message on a case the mentor holds: its row's last message (and its "new" count) change.
    socket.on('unread', refresh);
    socket.on('connect', refresh);
    return () => {
      socket.off('case:updated', refresh);
      socket.off('unread', refresh);
      socket.off('connect', refresh);
      if (timer.current) clearTimeout(timer.current);
      timer.current = null;
    };
  }, [socket, queryClient]);
}

export default function RoundsRoute() {
  const [params, setParams] = useSearchParams();
  const filters = filtersFromSearch(params);
  const rounds = useRounds(filters);
  const me = useUser().data;
  useLiveRounds();

  const change = (next: RoundsFilters) => setParams(searchFromFilters(next));
  const data = rounds.data;
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  const pageLink = (page: number) => `?${searchFromFilters({ ...filters, page })}`;

  return (
    <ContentLayout
      title="Rounds"
      lead={
        <>
          <p>Cases that need a mentor, the most urgent first. Claim one to take it on; the grower sees who is helping.</p>
          {me && (
            <p className="mt-2 text-base">
              <Link to={`/mentors/${me.id}`}>Your track record</Link>: the cases you helped, how soon you answered and how many batches came back.
            </p>
          )}
        </>
      }
    >
      <div className="flex flex-col gap-5">
        <RoundsFiltersForm filters={filters} onChange={change} />
        <ConnectionBanner
          className="empty:hidden"
          offlineText="The list is not refreshing. It catches up by itself when the connection is back."
          backText="The list is up to date."
        />

        {rounds.isPending ? (
          <Spinner label="Gathering the cases…" />
        ) : rounds.isError && !data ? (
          <Alert tone="danger" title="The rounds could not be loaded">
            <p>{rounds.error.message}</p>
            <Button variant="secondary" className="mt-2" onClick={() => void rounds.refetch()}>
              Try again
            </Button>
          </Alert>
        ) : data && data.items.length === 0 ? (
          <div className="rounded-soft border border-dashed border-line px-4 py-8 text-center">
            <p className="text-lg font-bold">No cases match these filters.</p>
            <p className="mt-1 text-loam-soft">
              {filters.page > 1 ? 'This page is past the end of the list.' : 'Nothing is waiting here right now — a good sign for the batches.'}
            </p>
            <Link to="/rounds" className={cx(buttonClasses('secondary'), 'mt-4')}>
              Show all open cases
            </Link>
          </div>
        ) : data && me ? (
          <div className={cx('flex flex-col gap-4 transition-opacity', rounds.isPlaceholderData && 'opacity-60')} aria-busy={rounds.isFetching}>
            <p className="text-base text-loam-soft" role="status">
              {data.total === 1 ? '1 case' : `${data.total} cases`}
              {pages > 1 && ` · page ${data.page} of ${pages}`}
            </p>
            <RoundsTable items={data.items} sort={filters.sort} myUserId={me.id} />
            {pages > 1 && (
              <nav aria-label="Pages of the rounds" className="flex items-center justify-between gap-3">
                {data.page > 1 ? (
                  <Link to={pageLink(data.page - 1)} className={buttonClasses('secondary')}>
                    ← Previous page
                  </Link>
                ) : (
                  <span />
                )}
                {data.page < pages && (
                  <Link to={pageLink(data.page + 1)} className={buttonClasses('secondary')}>
                    Next page →
                  </Link>
                )}
              </nav>
            )}
          </div>
        ) : null}
        <MailSettings show={['staff']} />
      </div>
    </ContentLayout>
  );
}
