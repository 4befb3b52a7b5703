// Track records of remedies and mentors, built on track-record.ts (Wilson lower bound for the
// recovery rate, Bayesian average for stars).
//
// What counts: only cases whose grower filed a recovery report (an outcome). A batch that came
// back "partly" counts as saved for the rate (the remedy did save something), and is shown
// separately so a reader can tell "saved 9, 3 of them partly" from "saved 9". A case a steward
// closed as lost because nobody answered has no outcome and counts nowhere: we do not know.
import { bayesianAverage, DEFAULT_RATING_PRIOR, rankByLowerBound, wilsonInterval, type RatingPrior } from './track-record';
import { REMEDIES, labelOf } from './vocabulary';

export interface OutcomeCounts {
  recovered: number;
  partly: number;
  lost: number;
  /** sum and count of the stars given with those reports */
  starsSum: number;
  starsCount: number;
}

export interface TrackRecord {
  trials: number;
  /** recovered + partly */
  saved: number;
  recovered: number;
  partly: number;
  lost: number;
  /** saved / trials, null with no trials */
  rate: number | null;
  /** 95 % Wilson score interval of the rate */
  lower: number;
  upper: number;
  stars: {
    /** Bayesian average with DEFAULT_RATING_PRIOR (or the prior given) */
    average: number;
    /** plain mean, null with no ratings */
    mean: number | null;
    ratings: number;
  };
}

export const EMPTY_COUNTS: OutcomeCounts = { recovered: 0, partly: 0, lost: 0, starsSum: 0, starsCount: 0 };

export function trackRecord(counts: OutcomeCounts, prior: RatingPrior = DEFAULT_RATING_PRIOR): TrackRecord {
  const saved = counts.recovered + counts.partly;
  const trials = saved + counts.lost;
  const interval = wilsonInterval(saved, trials);
  return {
    trials,
    saved,
    recovered: counts.recovered,
    partly: counts.partly,
    lost: counts.lost,
    rate: interval.rate,
    lower: interval.lower,
    upper: interval.upper,
    stars: {
      average: bayesianAverage(counts.starsSum, counts.starsCount, prior),
      mean: counts.starsCount > 0 ? counts.starsSum / counts.starsCount : null,
      ratings: counts.starsCount,
    },
  };
}

export interface RemedyRecord extends TrackRecord {
  remedy: string;
  label: string;
  /** false for advice that does not try to save the batch (discarding it): its "rate" is 0 by
   * design, so it is not ranked with the rescues and its text says what it is instead */
  rescue: boolean;
}

/** Remedies that give the batch up on purpose, usually because keeping it is not safe. */
export const NOT_A_RESCUE: ReadonlySet<string> = new Set(['discard-restart']);

/** One record per remedy: the rescues best first by the Wilson lower bound (not the raw rate),
 * then the advice to discard. */
export function remedyRecords(rows: ReadonlyArray<OutcomeCounts & { remedy: string }>): RemedyRecord[] {
  const records = rows.map((row) => ({ ...trackRecord(row), remedy: row.remedy, label: labelOf(REMEDIES, row.remedy), rescue: !NOT_A_RESCUE.has(row.remedy) }));
  const ranked = rankByLowerBound(records.filter((r) => r.rescue).map((r) => ({ ...r, successes: r.saved }))).map(({ item }) => {
    const { successes: _successes, ...record } = item;
    return record;
  });
  return [...ranked, ...records.filter((r) => !r.rescue).sort((a, b) => b.trials - a.trials)];
}

/** A whole percent for people: 0.6463 → "65 %". */
export function percentText(share: number): string {
  return `${Math.round(share * 100)} %`;
}

/** "saved 11 of 12 batches (lower bound 65 %)", with the partly saved ones named. */
export function describeRecord(record: Pick<TrackRecord, 'saved' | 'trials' | 'partly' | 'lower'> & { rescue?: boolean }): string {
  if (record.trials === 0) return 'no recovery reports yet';
  const batches = record.trials === 1 ? 'batch' : 'batches';
  if (record.rescue === false) return `the advice for ${record.trials} ${batches} not safe to keep or past saving`;
  const partly = record.partly > 0 ? `, ${record.partly} of them partly` : '';
  return `saved ${record.saved} of ${record.trials} ${batches}${partly} (lower bound ${percentText(record.lower)})`;
}
