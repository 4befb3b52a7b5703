// Track records that are fair to small numbers (PRODUCT.md, "The computation the job needs", 4):
// a recovery rate is ranked by the lower end of its Wilson score interval, and star ratings are
// pulled towards a prior, so that three lucky cases do not outrank three hundred steady ones.

/** The standard normal quantile for a two-sided 95 % interval, Φ⁻¹(0.975). */
export const Z_95 = 1.959963984540054;

export interface WilsonInterval {
  /** successes / trials, or null when there were no trials */
  rate: number | null;
  lower: number;
  upper: number;
}

/** Wilson (1927) score interval for a binomial proportion. With no trials nothing is known, so
 * the interval is the whole range, lower 0 and upper 1, and `rate` is null (not 0: "no record"
 * must not read as "never worked"). Throws RangeError for counts that are not whole numbers
 * with 0 ≤ successes ≤ trials, or a z that is not positive. */
export function wilsonInterval(successes: number, trials: number, z: number = Z_95): WilsonInterval {
  if (!Number.isInteger(successes) || !Number.isInteger(trials) || successes < 0 || trials < 0 || successes > trials) {
    throw new RangeError(`wilsonInterval needs whole counts with 0 ≤ successes ≤ trials, got ${successes}/${trials}`);
  }
  if (!(z > 0) || !Number.isFinite(z)) throw new RangeError(`wilsonInterval needs a positive z, got ${z}`);
  if (trials === 0) return { rate: null, lower: 0, upper: 1 };
  const n = trials;
  const p = successes / n;
  const z2 = z * z;
  const denominator = 1 + z2 / n;
  const centre = (p + z2 / (2 * n)) / denominator;
  const half = (z / denominator) * Math.sqrt((p * (1 - p)) / n + z2 / (4 * n * n));
  // At 0 or n successes one bound is exactly 0 or 1; clamp the rounding error away.
  return {
    rate: p,
    lower: successes === 0 ? 0 : Math.max(0, centre - half),
    upper: successes === n ? 1 : Math.min(1, centre + half),
  };
}

export interface RatingPrior {
  priorMean: number;
  priorWeight: number;
}

/** Common practice for a 1–5 star scale: start every record as if it had five ratings of 3.5
 * stars, a little above the middle because most advice given in good faith helps somewhat. */
export const DEFAULT_RATING_PRIOR: RatingPrior = { priorMean: 3.5, priorWeight: 5 };

/** (priorMean · priorWeight + sum) / (priorWeight + count); with no ratings, the prior mean. */
export function bayesianAverage(sum: number, count: number, prior: RatingPrior = DEFAULT_RATING_PRIOR): number {
  if (!Number.isFinite(sum) || !Number.isFinite(count) || count < 0) {
    throw new RangeError(`bayesianAverage needs a finite sum and a count of at least 0, got ${sum}, ${count}`);
  }
  if (!(prior.priorWeight >= 0) || !Number.isFinite(prior.priorMean)) {
    throw new RangeError('bayesianAverage needs a prior weight of at least 0 and a finite prior mean');
  }
  const weight = prior.priorWeight + count;
  if (weight === 0) return prior.priorMean;
  return (prior.priorMean * prior.priorWeight + sum) / weight;
}

export interface CountedRecord {
  successes: number;
  trials: number;
}

export interface RankedRecord<T> {
  item: T;
  interval: WilsonInterval;
}

/** Best first by the Wilson lower bound; ties go to the longer record, then to the higher rate.
 * Does not change the array it is given. */
export function rankByLowerBound<T extends CountedRecord>(items: readonly T[], z: number = Z_95): RankedRecord<T>[] {
  return items
    .map((item) => ({ item, interval: wilsonInterval(item.successes, item.trials, z) }))
    .sort(
      (a, b) =>
        b.interval.lower - a.interval.lower ||
        b.item.trials - a.item.trials ||
        (b.interval.rate ?? -1) - (a.interval.rate ?? -1),
    );
}
