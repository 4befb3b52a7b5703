/** The q-quantile of an ascending list (nearest rank); NaN when empty. */
export function quantile(sorted: readonly number[], q: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))];
}

export function percentiles(values: readonly number[]): { p50: number; p95: number; p99: number; max: number; n: number } {
  const sorted = [...values].sort((a, b) => a - b);
  return { p50: quantile(sorted, 0.5), p95: quantile(sorted, 0.95), p99: quantile(sorted, 0.99), max: sorted.at(-1) ?? NaN, n: sorted.length };
}
