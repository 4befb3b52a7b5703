// Rows 1 and 2 come from the search owners' own benches (scripts/bench-similar.ts and
// scripts/bench-library.ts), run as child processes: each makes its own throw-away cluster,
// seeds 100,000 resolved cases, times the real service and ranks the same queries with fuse.js
// over everything. Their summary lines are read back here.
import { spawnTs, tail } from './children';

export interface SearchFigures {
  name: string;
  p50: number;
  p95: number;
  max: number;
  agreementExact: number;
  agreementTies: number;
  /** seconds per query of the ranking over everything, as the child prints it */
  fullSeconds: number;
  /** the child's own words for that figure ("on average", …), to print beside it */
  fullLine: string;
  /** other lines worth keeping in the notes (the child's CPU line, its PostgreSQL anchor) */
  extra: string[];
  heading: string;
  wallSeconds: number;
}

const num = (s: string) => Number(s.replace(/,/g, ''));

/**
 * Reads the summary the child printed. The owners still change their wording, so this looks
 * for the figures, not for whole lines; where the child prints several settings side by side
 * (the library's BENCH_CAPS), the block marked as the service's setting is the one read.
 */
export function parseSearchBench(name: string, output: string, wallSeconds: number): SearchFigures {
  const lines = output.split('\n');
  const marked = lines.findIndex((l) => /the service.s setting/.test(l));
  const from = marked >= 0 ? marked : Math.max(0, lines.findIndex((l) => /^(batches like this|Field Library search) at /.test(l)));
  const after = (pattern: RegExp) => lines.slice(from).map((l) => l.match(pattern)).find(Boolean) ?? null;
  const anywhere = (pattern: RegExp) => lines.map((l) => l.match(pattern)).find(Boolean) ?? null;
  const latency = after(/latency\s+p50 ([\d.,]+) ms\s+p95 ([\d.,]+) ms\s+max ([\d.,]+) ms/);
  const agreement = after(/agreement[^:]*: ([\d.]+) % exact, ([\d.]+) % counting ties/);
  const full = anywhere(/full (?:fuse\.js )?ranking: (?:index built in [\d.]+ s, then )?([\d.]+) s per (?:draft|query)(.*)$/);
  if (!latency || !agreement || !full) throw new Error(`${name}: could not read its summary.\n${tail(output)}`);
  const extra = [anywhere(/^\s*CPU\s+.*$/), anywhere(/^anchor: .*$/)].filter((m): m is RegExpMatchArray => m !== null).map((m) => m[0].trim().replace(/\s+/g, ' '));
  return {
    name,
    p50: num(latency[1]),
    p95: num(latency[2]),
    max: num(latency[3]),
    agreementExact: num(agreement[1]),
    agreementTies: num(agreement[2]),
    fullSeconds: num(full[1]),
    fullLine: full[0].trim(),
    extra,
    heading: anywhere(/^(?:batches like this|Field Library search) at .*$/)?.[0] ?? '',
    wallSeconds,
  };
}

/** Runs one of the search benches to the end (at most `timeoutMs`) and reads its figures. */
export async function runSearchBench(name: string, script: string, timeoutMs: number): Promise<SearchFigures> {
  const started = Date.now();
  // SIGINT: their scripts stop their own cluster on SIGINT (and only then).
  // A SIGKILL would leave their cluster running, so a stop waits for them (up to 5 minutes).
  const child = spawnTs(name, script, { stopSignal: 'SIGINT', killAfterMs: 5 * 60_000, echo: true, env: { LOG_LEVEL: 'error' } });
  const timer = setTimeout(() => void child.stop(), timeoutMs);
  const code = await child.exited;
  clearTimeout(timer);
  const output = child.output();
  // Exit 1 only says "over budget"; the figures are still printed then.
  if (code !== 0 && code !== 1) throw new Error(`${name} ended with code ${code}.\n${tail(output)}`);
  return parseSearchBench(name, output, (Date.now() - started) / 1000);
}
