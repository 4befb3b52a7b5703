// The Field Library (PRODUCT.md screen 8): search with filters kept in the address, so a search
// can be shared or bookmarked; results best first; how each remedy holds up.
import { Link, useSearchParams } from 'react-router';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { Alert } from '../../../components/ui/alert';
import { buttonClasses } from '../../../components/ui/button';
import { Spinner } from '../../../components/ui/spinner';
import { useLibrarySearch, type LibrarySearch } from '../../../features/library/api/search-library';
import { LibraryResultCard } from '../../../features/library/components/library-result-card';
import { LibrarySearchForm } from '../../../features/library/components/library-search-form';
import { RemedyRecordsPanel } from '../../../features/library/components/remedy-records-panel';
import { paramsFromSearch, searchFromParams } from '../../../features/library/lib/library-params';
import { grouped } from '../../../lib/english-numbers';

function resultsLine(total: number, search: LibrarySearch): string {
  const what = total === 1 ? '1 result' : `${grouped(total)} results`;
  return search.q ? `${what} for “${search.q}”` : `${what}`;
}

export default function FieldLibraryRoute() {
  const [params, setParams] = useSearchParams();
  const search = searchFromParams(params);
  const results = useLibrarySearch(search);
  const data = results.data;
  const page = search.page ?? 1;
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  const pageLink = (n: number) => `?${paramsFromSearch({ ...search, page: n }).toString()}`;
  const readAs = data ? Object.entries(data.readAs) : [];

  return (
    <ContentLayout
      title="Field Library"
      lead="Lessons from batches that other growers saved or lost, and the guides of Sporewell. Every remedy shows how often it actually worked."
    >
      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="flex min-w-0 flex-col gap-6">
          <LibrarySearchForm search={search} onChange={(next) => setParams(paramsFromSearch(next))} />

          <section aria-labelledby="library-results-heading" aria-busy={results.isFetching} className="flex flex-col gap-4">
            <h2 id="library-results-heading" className="sr-only">
              Results
            </h2>
            <div role="status" className="flex flex-col gap-1">
              {data && <p className="text-lg font-bold">{resultsLine(data.total, search)}</p>}
              {readAs.length > 0 && (
                <p className="text-loam-soft">
                  {readAs.map(([word, terms], i) => (
                    <span key={word}>
                      {i > 0 && ' '}“{word}” was also read as {terms.join(', ')}.
                    </span>
                  ))}
                </p>
              )}
            </div>
            {results.isPending && <Spinner label="Searching the Field Library…" />}
            {results.isError && (
              <Alert tone="danger" title="The library could not be searched">
                {results.error.message}
              </Alert>
            )}
            {data && data.items.length === 0 && (
              <Alert title={search.q ? 'Nothing matches that yet' : 'Nothing here yet'}>
                {search.q ? 'Try fewer or other words, or clear the stage and sign filters.' : 'Try another stage or sign.'}{' '}
                If your batch is in trouble now, <Link to="/cases/new">open a case</Link> and a mentor will look at it.
              </Alert>
            )}
            {data && data.items.length > 0 && (
              <ol className="flex flex-col gap-4" aria-label="Results, best first">
                {data.items.map((item) => (
                  <li key={item.slug}>
                    <LibraryResultCard item={item} />
                  </li>
                ))}
              </ol>
            )}
            {data && pages > 1 && (
              <nav aria-label="Pages of results" className="flex flex-wrap items-center gap-3">
                {page > 1 && (
                  <Link to={pageLink(page - 1)} className={buttonClasses('secondary')}>
                    Previous page
                  </Link>
                )}
                <span className="font-bold">
                  Page {page} of {pages}
                </span>
                {page < pages && (
                  <Link to={pageLink(page + 1)} className={buttonClasses('secondary')}>
                    Next page
                  </Link>
                )}
              </nav>
            )}
          </section>
        </div>

        <aside className="flex flex-col gap-4" aria-label="Remedy track records">
          {data && <RemedyRecordsPanel records={data.remedyRecords} />}
          <p className="text-base text-loam-soft">
            Field notes are shared with the grower’s consent, without names, e-mail addresses or places. Advice here comes from community
            members, not licensed professionals.
          </p>
        </aside>
      </div>
    </ContentLayout>
  );
}
