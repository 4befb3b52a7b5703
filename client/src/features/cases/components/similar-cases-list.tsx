import { useId } from 'react';
import { Link } from 'react-router';
import type { SimilarItem } from '@shared/case-schemas';
import { CAUSES, REMEDIES, SYMPTOMS, labelOf } from '@shared/vocabulary';
import { Spinner } from '../../../components/ui/spinner';
import { cx } from '../../../components/ui/cx';

export const OUTCOME_LABELS: Record<NonNullable<SimilarItem['outcome']>, string> = {
  recovered: 'Recovered',
  partly: 'Partly recovered',
  lost: 'Lost',
};

const OUTCOME_TONES: Record<NonNullable<SimilarItem['outcome']>, string> = {
  recovered: 'bg-moss-mist text-moss-deep border-moss',
  partly: 'bg-clay-mist text-clay-deep border-clay',
  lost: 'bg-ember-mist text-ember border-ember',
};

/**
 * "Batches like this": resolved cases close to this one, each with what was wrong, what was
 * done and how it ended, and why Sporewell thinks it is alike. Mentors and stewards get the
 * cases themselves; a grower gets the anonymised field notes made from other growers' cases
 * (the server never sends a grower another grower's case), linked into the Field Library.
 */
export function SimilarCasesList({
  items,
  state,
  error,
  emptyText,
  headingLevel = 2,
  className,
}: {
  items: SimilarItem[] | undefined;
  state: 'idle' | 'loading' | 'refreshing' | 'ready' | 'error';
  error?: string;
  emptyText: string;
  headingLevel?: 2 | 3;
  className?: string;
}) {
  const headingId = useId();
  const Heading = headingLevel === 2 ? 'h2' : 'h3';

  return (
    <section aria-labelledby={headingId} aria-busy={state === 'loading' || state === 'refreshing'} className={cx('flex flex-col gap-3', className)}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <Heading id={headingId} className="text-xl font-extrabold">
          Batches like this
        </Heading>
        {state === 'refreshing' && <span className="text-sm text-loam-soft">Updating…</span>}
      </div>
      {state === 'idle' && <p className="text-loam-soft">{emptyText}</p>}
      {state === 'loading' && <Spinner label="Looking for batches like this…" />}
      {state === 'error' && <p className="font-semibold text-ember">Could not look for batches like this: {error}</p>}
      {(state === 'ready' || state === 'refreshing') && items && items.length === 0 && (
        <p className="text-loam-soft">No resolved case is close to this one yet. A mentor will look at it with fresh eyes.</p>
      )}
      {items && items.length > 0 && state !== 'idle' && state !== 'loading' && (
        <ol className="flex flex-col gap-3" aria-label="Resolved cases like this one, closest first">
          {items.map((item) => (
            <li key={item.kind === 'note' ? `note-${item.slug}` : `case-${item.id}`} className="rounded-soft border border-line bg-rice p-4">
              <SimilarCaseItem item={item} heading={headingLevel === 2 ? 'h3' : 'h4'} />
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}

function SimilarCaseItem({ item, heading: Heading }: { item: SimilarItem; heading: 'h3' | 'h4' }) {
  const outcome = item.outcome ?? (item.kind === 'case' && item.status === 'lost' ? 'lost' : 'recovered');
  return (
    <article className="flex flex-col gap-2">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <Heading className="font-extrabold leading-snug">
          {item.kind === 'note' ? <Link to={`/library/${item.slug}`}>{item.title}</Link> : <Link to={`/cases/${item.id}`}>{item.title}</Link>}
        </Heading>
        <span className={cx('rounded-full border px-2.5 py-0.5 text-sm font-bold whitespace-nowrap', OUTCOME_TONES[outcome])}>
          {OUTCOME_LABELS[outcome]}
        </span>
      </div>
      <p className="text-sm text-loam-soft">
        <span className="font-bold text-loam">{item.stage}</span>
        {item.symptoms.length > 0 && <> · {item.symptoms.map((s) => labelOf(SYMPTOMS, s).toLowerCase()).join(', ')}</>}
        {item.kind === 'note' && <> · field note</>}
      </p>
      {item.kind === 'note' && item.summary && <p className="line-clamp-3">{item.summary}</p>}
      {(item.cause || item.remedy) && (
        <p>
          <span className="sr-only">Cause: </span>
          {item.cause ? labelOf(CAUSES, item.cause) : 'Cause not recorded'}
          <span aria-hidden="true"> → </span>
          <span className="sr-only">. Remedy: </span>
          <strong>{item.remedy ? labelOf(REMEDIES, item.remedy) : 'no remedy recorded'}</strong>
        </p>
      )}
      {item.reasons.length > 0 && (
        <p className="text-sm text-loam-soft">
          <span className="font-bold">Why it matched:</span> {item.reasons.join('; ')}
        </p>
      )}
    </article>
  );
}
