import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { URGENCY_WEIGHTS, type UrgencyLevel } from '@shared/urgency';
import { cx } from '../../../components/ui/cx';
import { caseQueryOptions } from '../../cases/api/get-case';

const LEVELS: Record<UrgencyLevel, { words: string; className: string }> = {
  high: { words: 'High', className: 'bg-ember text-rice' },
  medium: { words: 'Medium', className: 'bg-clay-mist text-clay-deep border border-clay' },
  low: { words: 'Low', className: 'bg-moss-mist text-moss-deep border border-moss' },
};

/** The level and score; "why?" opens where the points came from (asked of the case itself,
 * only when someone wants to know, so the list stays light). */
export function UrgencyBadge({ caseId, score, level }: { caseId: number; score: number; level: UrgencyLevel }) {
  const [open, setOpen] = useState(false);
  const reasons = useQuery({ ...caseQueryOptions(caseId), enabled: open, select: (c) => c.urgencyReasons });
  const look = LEVELS[level];

  return (
    <div className="flex flex-col items-start gap-1">
      <span className={cx('inline-flex items-center gap-1.5 whitespace-nowrap rounded-full px-2.5 py-0.5 text-sm font-extrabold', look.className)}>
        {look.words}
        <span aria-hidden="true">·</span>
        <span>
          {score}
          <span className="sr-only"> of 100 urgency points</span>
        </span>
      </span>
      <details className="relative text-sm" onToggle={(event) => setOpen(event.currentTarget.open)}>
        <summary className="inline-flex min-h-11 cursor-pointer items-center font-bold text-moss-deep underline underline-offset-4 md:min-h-6">
          Why?
        </summary>
        {/* Over the rows rather than in the cell, so opening it does not reflow the table. */}
        <div className="absolute left-0 top-full z-20 mt-1 w-72 max-w-[80vw] rounded-soft border border-line bg-rice p-3 text-loam shadow-lg">
          {reasons.isPending ? (
            <p className="text-loam-soft">Adding up the points…</p>
          ) : reasons.isError ? (
            <p className="text-ember">{reasons.error.message}</p>
          ) : (
            <ul className="list-disc space-y-1 pl-4">
              {reasons.data.map((reason) => (
                <li key={reason}>{reason}</li>
              ))}
            </ul>
          )}
          <p className="mt-2 text-loam-soft">
            High from {URGENCY_WEIGHTS.levels.high} points, medium from {URGENCY_WEIGHTS.levels.medium}. Symptoms count at most{' '}
            {URGENCY_WEIGHTS.symptomCap}; waiting adds {URGENCY_WEIGHTS.waitingPointsPerHour} an hour, up to {URGENCY_WEIGHTS.waitingCap}.
          </p>
        </div>
      </details>
    </div>
  );
}
