// The one table `npm run bench` prints: each figure with its budget and a verdict beside it.
export type Verdict = 'ok' | 'MISSES' | '' | 'not measured' | 'failed';

export interface Row {
  work: string;
  measured: string;
  budget: string;
  verdict: Verdict;
}

export const verdict = (ok: boolean): Verdict => (ok ? 'ok' : 'MISSES');

export function renderTable(rows: Row[]): string {
  const header: Row = { work: 'work', measured: 'measured', budget: 'budget', verdict: '' };
  const cells = (r: Row) => [r.work, r.measured, r.budget, r.verdict];
  const all = [header, ...rows].map(cells);
  const widths = all[0].map((_, i) => Math.max(...all.map((c) => c[i].length)));
  const line = (c: string[]) => `| ${c.map((s, i) => s.padEnd(widths[i])).join(' | ')} |`;
  return [line(all[0]), `|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`, ...all.slice(1).map(line)].join('\n');
}

export const ms = (x: number) => (Number.isFinite(x) ? `${x < 10 ? x.toFixed(1) : Math.round(x)} ms` : 'n/a');
export const int = (x: number) => Math.round(x).toLocaleString('en');
