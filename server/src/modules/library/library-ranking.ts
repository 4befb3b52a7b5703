// fuse.js ranks what PostgreSQL narrowed. Each query word is searched on its own (fuzzy, anywhere
// in the field) over the short fields a reader judges a result by: title, summary and the
// vocabulary labels. The word scores are combined by rarity:
//
//   score = 1 − Σ idf(w) · (1 − fuse(w)) / Σ idf(w),   idf(w) = ln(1 + resolved cases / cases with w)
//
// (0 is a perfect match of every word, 1 no match at all). fuse.js scores a word in an entry as
// Π over the fields it is found in of s^(weight · norm), s being its match score in that field
// (never below 0.001, not even for an exact match) and norm = 1/√(tokens in the field); PostgreSQL
// mirrors that to rank candidates (library.repository.ts, `matchHead`). A word's rarity comes from
// search_terms, the same counts "batches like this" weighs words by, not from the entries at hand:
// so an entry scores the same whether fuse.js sees 200 candidates or all 100,000 entries, and the
// benchmark's full ranking is comparable with ours entry for entry.
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

export interface WeightedWord {
  word: string;
  idf: number;
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
  shouldSort: false,
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

/** The fields fuse.js searches, with their weights normalised the way fuse.js does (sum 1). */
export const RANKED_FIELDS = (() => {
  const keys = FUSE_OPTIONS.keys as Array<{ name: 'title' | 'summary' | 'labels'; weight: number }>;
  const total = keys.reduce((sum, k) => sum + k.weight, 0);
  return keys.map((k) => ({ field: k.name, weight: k.weight / total }));
})();

/** What fuse.js scores a typed word against a field holding `term` (0 exact, up to its
 * threshold), or null when fuse.js would not match it at all. */
export function termScore(typed: string, term: string): number | null {
  const result = Fuse.match(typed, term, { ignoreLocation: true, threshold: FUSE_OPTIONS.threshold, isCaseSensitive: false });
  return result.isMatch ? result.score : null;
}

/** How much a word counts: rarer words more (the +1 keeps a word in every case above zero). */
export function idfOf(resolvedCases: number, casesWithWord: number): number {
  const uses = Math.max(1, casesWithWord);
  return Math.log(1 + Math.max(resolvedCases, uses) / uses);
}

export interface Scored<T> {
  entry: T;
  /** 0 is a perfect match, 1 no match at all */
  score: number;
}

export interface FuseRanker<T> {
  fuse: Fuse<RankDoc<T>>;
  docs: RankDoc<T>[];
}

/** The fuse.js index over some entries: built per search for the narrowed few, once for all of
 * them in the benchmark. */
export function fuseRanker<T extends RankableEntry>(entries: readonly T[]): FuseRanker<T> {
  const docs: RankDoc<T>[] = entries.map((entry) => ({ entry, title: entry.title, summary: entry.summary, labels: labelsOf(entry) }));
  return { fuse: new Fuse(docs, FUSE_OPTIONS as IFuseOptions<RankDoc<T>>), docs };
}

/** Every entry with its combined score for the words; entries no word matches score 1. */
export function fuseScores<T extends RankableEntry>(entries: readonly T[] | FuseRanker<T>, words: readonly WeightedWord[]): Scored<T>[] {
  const { fuse, docs } = Array.isArray(entries) ? fuseRanker(entries as readonly T[]) : (entries as FuseRanker<T>);
  const total = words.reduce((sum, w) => sum + w.idf, 0);
  const gained = new Map<number, number>();
  for (const { word, idf } of words) {
    for (const result of fuse.search(word)) gained.set(result.refIndex, (gained.get(result.refIndex) ?? 0) + idf * (1 - (result.score ?? 1)));
  }
  return docs.map((doc, index) => {
    const gain = gained.get(index);
    return { entry: doc.entry, score: gain === undefined || total === 0 ? 1 : 1 - gain / total };
  });
}

/** Best first by score; `tieBreak` orders equal scores (e.g. the text rank). */
export function byScore<T>(scored: Scored<T>[], tieBreak: (a: T, b: T) => number = () => 0): Scored<T>[] {
  return [...scored].sort((a, b) => a.score - b.score || tieBreak(a.entry, b.entry));
}
