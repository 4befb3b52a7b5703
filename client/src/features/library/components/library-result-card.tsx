import { Link } from 'react-router';
import type { LibraryListItem } from '@shared/library-schemas';
import { CauseRemedyTerms } from './cause-remedy-terms';
import { EntryTags } from './entry-tags';
import { KindBadge, OutcomeBadge } from './outcome-badge';
import { RemedyRecord } from './remedy-record';

/** One search result: a guide, or a field note with its cause, remedy, outcome and the remedy's record. */
export function LibraryResultCard({ item }: { item: LibraryListItem }) {
  return (
    <article className="flex flex-col gap-3 rounded-soft border border-line bg-rice p-4 sm:p-5">
      <div className="flex flex-wrap items-center gap-2">
        <KindBadge kind={item.kind} />
        {item.outcome && <OutcomeBadge outcome={item.outcome} className="text-sm" />}
      </div>
      <h3 className="text-xl font-extrabold leading-snug">
        <Link to={`/library/${item.slug}`}>{item.title}</Link>
      </h3>
      <EntryTags stages={item.stages} symptoms={item.symptoms} limit={5} />
      {item.summary && <p className="text-loam-soft">{item.summary}</p>}
      {item.kind === 'note' && (item.cause || item.remedy) && (
        <dl className="grid gap-x-3 gap-y-1 sm:grid-cols-[auto_1fr]">
          <CauseRemedyTerms cause={item.cause} remedy={item.remedy} />
        </dl>
      )}
      {item.remedyRecord && (
        <div className="rounded-soft bg-rice-deep p-3">
          <p className="text-sm font-bold uppercase tracking-wide text-loam-soft">This remedy across Sporewell</p>
          <RemedyRecord record={item.remedyRecord} showLabel={false} />
        </div>
      )}
    </article>
  );
}
