import { cx } from '../../../components/ui/cx';

/** A picture of a recovery rate and its 95 % range: the band is where the true rate likely lies,
 * the mark is what happened so far. Decorative: the words beside it say the same. */
export function TrackRecordBar({ rate, lower, upper, className }: { rate: number | null; lower: number; upper: number; className?: string }) {
  const pct = (x: number) => `${Math.round(x * 1000) / 10}%`;
  return (
    <div aria-hidden="true" className={cx('relative h-3 w-full max-w-64 rounded-full border border-line bg-rice', className)}>
      <div className="absolute inset-y-0 rounded-full bg-moss-mist ring-1 ring-moss" style={{ left: pct(lower), width: pct(Math.max(upper - lower, 0.01)) }} />
      {rate !== null && <div className="absolute -inset-y-1 w-1 -translate-x-1/2 rounded-full bg-moss-deep" style={{ left: pct(rate) }} />}
    </div>
  );
}
