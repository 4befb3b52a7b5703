// A guide or a field note (/library/:slug): its text rendered from Markdown (no raw HTML), what
// it is about, for a note how it turned out and how its remedy holds up, its sources, and the
// safety cautions.
import { lazy, Suspense } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { useSuspenseQuery } from '@tanstack/react-query';
import { Link, data, useParams, type LoaderFunctionArgs } from 'react-router';
import { discardSignsIn, DISCARD_SIGN_WORDS } from '@shared/cautions';
import { PAGE_WIDTH } from '../../../components/layouts/content-layout';
import { SafetyCautions } from '../../../components/safety-cautions';
import { Alert } from '../../../components/ui/alert';
import { cx } from '../../../components/ui/cx';
import { useUser } from '../../../features/auth/api/get-me';
import { libraryEntryQueryOptions } from '../../../features/library/api/get-library-entry';
import { CauseRemedyTerms } from '../../../features/library/components/cause-remedy-terms';
import { EntryMarkdown } from '../../../features/library/components/entry-markdown';
import { EntryTags } from '../../../features/library/components/entry-tags';
import { KindBadge, OutcomeBadge } from '../../../features/library/components/outcome-badge';
import { RemedyRecord } from '../../../features/library/components/remedy-record';
import { dayMonthYearOf } from '../../../lib/english-dates';

function slugOf(raw: string | undefined): string {
  if (!raw || !/^[a-z0-9][a-z0-9-]{0,119}$/.test(raw)) throw data(null, { status: 404 });
  return raw;
}

export const clientLoader = (queryClient: QueryClient) => async ({ params }: LoaderFunctionArgs) => {
  await queryClient.ensureQueryData(libraryEntryQueryOptions(slugOf(params.slug)));
  return null;
};

const dateText = (iso: string) => dayMonthYearOf(new Date(iso));

// Stewards only: its code (and the schema it checks with) is not fetched for anyone else.
const TakeDownPanel = lazy(() => import('../../../features/library/components/take-down-panel').then((m) => ({ default: m.TakeDownPanel })));

export default function FieldNoteRoute() {
  const slug = slugOf(useParams().slug);
  const { data: entry } = useSuspenseQuery(libraryEntryQueryOptions(slug));
  const isNote = entry.kind === 'note';
  const steward = useUser().data?.role === 'steward';
  const discardSigns = discardSignsIn(entry.symptoms);

  return (
    <div className={cx(PAGE_WIDTH, 'py-8 sm:py-10')}>
      <title>{`${entry.title} · Field Library · Sporewell`}</title>
      <p>
        <Link to="/library">← Field Library</Link>
      </p>
      <article className="mt-4 grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="min-w-0">
          <header className="flex flex-col gap-3">
            <div className="flex flex-wrap items-center gap-2">
              <KindBadge kind={entry.kind} />
              {entry.outcome && <OutcomeBadge outcome={entry.outcome} />}
            </div>
            <h1 className="text-3xl font-extrabold tracking-tight text-balance sm:text-4xl">{entry.title}</h1>
            <EntryTags stages={entry.stages} symptoms={entry.symptoms} />
            {entry.summary && <p className="max-w-prose text-lg text-loam-soft">{entry.summary}</p>}
            <p className="text-base text-loam-soft">
              {isNote ? `Shared ${dateText(entry.publishedAt)}, with the grower’s consent and without names or places.` : `Updated ${dateText(entry.updatedAt)}.`}
            </p>
          </header>

          {isNote && discardSigns.length > 0 && (
            <Alert tone="danger" title="A batch like this is discarded, not rescued" className="mt-6 max-w-prose">
              This one showed {discardSigns.map((s) => DISCARD_SIGN_WORDS[s]).join(', ')}. Wear a mask, throw it out sealed, wash your hands and
              scrub the container before you start again.
            </Alert>
          )}

          <EntryMarkdown body={entry.body} />

          {entry.note && entry.note.photos.length > 0 && (
            <section aria-labelledby="note-photos-heading" className="mt-8">
              <h2 id="note-photos-heading" className="text-2xl font-extrabold">
                Photos
              </h2>
              <ul className="mt-3 grid grid-cols-2 gap-3 sm:grid-cols-3">
                {entry.note.photos.map((photo, i) => (
                  <li key={photo.url}>
                    <a href={photo.url} className="block">
                      <img
                        src={photo.thumbUrl}
                        width={photo.width}
                        height={photo.height}
                        loading="lazy"
                        alt={`Photo ${i + 1} of the batch (opens the full size)`}
                        className="aspect-square w-full rounded-soft border border-line object-cover"
                      />
                    </a>
                  </li>
                ))}
              </ul>
            </section>
          )}

          {entry.sources.length > 0 && (
            <section aria-labelledby="entry-sources-heading" className="mt-8 max-w-prose">
              <h2 id="entry-sources-heading" className="text-2xl font-extrabold">
                Sources
              </h2>
              <ul className="mt-3 list-disc space-y-1 pl-6 text-base">
                {entry.sources.map((source) => (
                  <li key={source}>{source}</li>
                ))}
              </ul>
            </section>
          )}
        </div>

        <aside className="flex flex-col gap-4" aria-label={isNote ? 'What was done and how it held up' : 'Safety'}>
          {isNote && (
            <section aria-labelledby="note-facts-heading" className="flex flex-col gap-3 rounded-soft border border-line bg-rice-deep p-4 sm:p-5">
              <h2 id="note-facts-heading" className="text-xl font-extrabold">
                In short
              </h2>
              <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
                <CauseRemedyTerms cause={entry.cause} remedy={entry.remedy} />
                {entry.note?.stars != null && (
                  <>
                    <dt className="font-bold">Advice rated</dt>
                    <dd>{entry.note.stars} of 5 by the grower</dd>
                  </>
                )}
                {entry.note?.daysToResolve != null && (
                  <>
                    <dt className="font-bold">Settled in</dt>
                    <dd>{entry.note.daysToResolve === 0 ? 'the same day' : entry.note.daysToResolve === 1 ? '1 day' : `${entry.note.daysToResolve} days`}</dd>
                  </>
                )}
              </dl>
              {entry.remedyRecord && (
                <div className="flex flex-col gap-1 border-t border-line pt-3">
                  <h3 className="font-extrabold">This remedy across Sporewell</h3>
                  <RemedyRecord record={entry.remedyRecord} showLabel={false} />
                  <p className="text-sm text-loam-soft">The band is the range the true rate likely lies in (95 %); the mark is what happened so far.</p>
                </div>
              )}
            </section>
          )}
          <SafetyCautions />
          {isNote && steward && (
            <Suspense fallback={null}>
              <TakeDownPanel slug={entry.slug} />
            </Suspense>
          )}
        </aside>
      </article>
    </div>
  );
}
