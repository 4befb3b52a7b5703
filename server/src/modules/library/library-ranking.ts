// fuse.js ranks what PostgreSQL narrowed. Token search (one fuzzy match per query word, TF-IDF
// weighted, any word may match) over the short fields a reader judges a result by: title,
// summary and the vocabulary labels. The benchmark runs the same ranking over every entry to
// check that narrowing first keeps the same top results.
import Fuse, { type IFuseOptions } from 'fuse.js';
import { CAUSES, REMEDIES, STAGES, SYMPTOMS, labelOf } from '../../../shared/vocabulary';

export interface RankableEntry {
  id: number;
  title: string;
  summary: string;
  stages: readonly string[];
  symptoms: readonly string[];
  cause: string | null;
  remedy: string | null;
}

interface RankDoc<T> {
  entry: T;
  title: string;
  summary: string;
  labels: string;
}

export const FUSE_OPTIONS: IFuseOptions<RankDoc<unknown>> = {
  keys: [
    { name: 'title', weight: 3 },
    { name: 'summary', weight: 2 },
    { name: 'labels', weight: 1.5 },
  ],
  includeScore: true,
  ignoreLocation: true,
  threshold: 0.4,
  useTokenSearch: true,
  tokenMatch: 'any',
};

export function labelsOf(entry: Pick<RankableEntry, 'stages' | 'symptoms' | 'cause' | 'remedy'>): string {
  return [
    ...entry.stages.map((s) => labelOf(STAGES, s)),
    ...entry.symptoms.map((s) => labelOf(SYMPTOMS, s)),
    entry.cause ? labelOf(CAUSES, entry.cause) : '',
    entry.remedy ? labelOf(REMEDIES, entry.remedy) : '',
  ]
    .filter(Boolean)
    .join(', ');
}

export interface Scored<T> {
  entry: T;
  /** fuse.js score: 0 is a perfect match, 1 no match at all */
  score: number;
}

/** Every entry with its fuse.js score for the words; entries fuse does not match score 1. */
export function fuseScores<T extends RankableEntry>(entries: readonly T[], words: readonly string[]): Scored<T>[] {
  const docs: RankDoc<T>[] = entries.map((entry) => ({ entry, title: entry.title, summary: entry.summary, labels: labelsOf(entry) }));
  const fuse = new Fuse(docs, FUSE_OPTIONS as IFuseOptions<RankDoc<T>>);
  const scores = new Map<number, number>();
  for (const result of fuse.search(words.join(' '))) scores.set(result.refIndex, result.score ?? 1);
  return docs.map((doc, index) => ({ entry: doc.entry, score: scores.get(index) ?? 1 }));
}

/** Best first by fuse.js score; `tieBreak` orders equal scores (e.g. the text rank). */
export function byScore<T>(scored: Scored<T>[], tieBreak: (a: T, b: T) => number = () => 0): Scored<T>[] {
  return [...scored].sort((a, b) => a.score - b.score || tieBreak(a.entry, b.entry));
}
