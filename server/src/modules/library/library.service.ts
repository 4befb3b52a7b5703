// The Field Library: search (PostgreSQL narrows, fuse.js ranks), one entry, and the remedy track
// records every field note shows.
//
// Search, step by step:
// 1. The query is cut into words the way resolved cases are (lower-case a–z, 3–30 letters, no
//    stop words; accents folded first). A query with no such words finds nothing.
// 2. Each word is read as itself and as up to three known words like it (trigram similarity
//    ≥ MIN_SIMILARITY over search_terms, the words of resolved cases and guides): "bubbels" is
//    also read as "bubbles", "soure" as "sour". The same table and word-cutting as "batches like
//    this" (cases/similar.service.ts), but not its single best correction at ≥ 0.4: "bubbels" is
//    only 0.33 like "bubbles", and since the readings are OR-ed and fuse.js ranks afterwards,
//    a looser, wider reading costs little here. A word is also read as any known word one slip
//    away (two neighbouring letters swapped or one dropped, slipsOf): "cluody" is only 0.27 like
//    "cloudy" by trigrams, yet fuse.js matches the two.
// 3. PostgreSQL narrows to at most LIBRARY_TUNING.candidates entries, with the stage/symptom/kind
//    filters applied, on the fields fuse.js ranks on (title, summary, labels). Rare words first
//    (as many as together appear in about LIBRARY_TUNING.rowBudget entries): every entry holding
//    one, found by full-text search (GIN) and ranked in SQL the way fuse.js will score it. Common
//    words fill what room is left from their postings (migration 0304): the entries each scores
//    best in, strongest first, never all of their tens of thousands of matches — after the
//    entries holding every common word, which outscore them. Then entries that
//    name a word only in their body; when that finds almost nothing, titles with a trigram-similar word.
// 4. fuse.js scores the candidates against the words as typed, each word weighted by the rarity
//    of what it was read as (library-ranking.ts).
// 5. Best first: the fuse.js score, nudged by how well the entry's remedy holds up (the lower
//    bound of its Wilson interval; a guide counts as GUIDE_QUALITY). The nudge is at most
//    QUALITY_WEIGHT, so it reorders close matches and never lifts a poor match over a good one.
import type { Outcome } from '../../../shared/closing-schemas';
import type { LibraryEntry, LibraryList, LibraryListItem, LibraryPhoto, LibraryQuery, RemedyRecordView } from '../../../shared/library-schemas';
import { describeRecord, remedyRecords } from '../../../shared/remedy-records';
import { conflict, notFound } from '../../lib/errors';
import { queryWords } from '../cases/search-index';
import { resolvedCaseCount } from '../cases/similar.service';
import { byScore, fuseScores, idfOf, termScore, type WeightedWord } from './library-ranking';
import { libraryRepository as repo, type EntryFilters, type EntryRow, type RankedEntryRow, type RankWord } from './library.repository';

/** How many candidates PostgreSQL hands to fuse.js (scripts/bench-library.ts measures the choice). */
export const LIBRARY_TUNING = {
  candidates: 100,
  /** the rare words that narrow first may together be in about this many cases */
  rowBudget: 1500,
  /** a common word's strongest postings read per reading of it */
  perReading: 200,
  /** before the postings, the entries holding every common word (when there are two or more) */
  everyCommonWordFirst: true,
};
const KNOWN_WORDS_PER_WORD = 3;
/** Known words containing a typed one, per word (fuse.js matches inside longer words). */
const CONTAINING_PER_WORD = 12;
/** fuse.js never scores a match below this, not even an exact one. */
const FUSE_SCORE_FLOOR = 0.001;
const MIN_SIMILARITY = 0.3;
const MAX_WORDS = 8;
const FEW_MATCHES = 5;
export const QUALITY_WEIGHT = 0.15;
export const GUIDE_QUALITY = 0.6;
const RECORDS_TTL_MS = 30_000;
export const SLUG_PATTERN = /^[a-z0-9][a-z0-9-]{0,119}$/;

interface RecordsCache {
  at: number;
  list: RemedyRecordView[];
  byRemedy: Map<string, RemedyRecordView>;
}
let recordsCache: RecordsCache | null = null;

/** Call after an outcome changed, so this process shows it at once (others within RECORDS_TTL_MS). */
export function invalidateRemedyRecords(): void {
  recordsCache = null;
}

export async function getRemedyRecords(): Promise<RecordsCache> {
  if (recordsCache && Date.now() - recordsCache.at < RECORDS_TTL_MS) return recordsCache;
  const list = remedyRecords(await repo.outcomeCountsByRemedy()).map((r) => ({ ...r, text: describeRecord(r) }));
  recordsCache = { at: Date.now(), list, byRemedy: new Map(list.map((r) => [r.remedy, r])) };
  return recordsCache;
}

/** The searchable words of a query (step 1 above). */
export function searchWordsOf(q: string): string[] {
  const folded = q.normalize('NFKD').replace(/\p{M}+/gu, '');
  return queryWords(folded).slice(0, MAX_WORDS);
}

function toListItem(row: EntryRow, records: RecordsCache): LibraryListItem {
  return {
    slug: row.slug,
    kind: row.kind,
    title: row.title,
    summary: row.summary,
    stages: row.stages,
    symptoms: row.symptoms,
    cause: row.cause,
    remedy: row.remedy,
    outcome: row.outcome as Outcome | null,
    publishedAt: new Date(row.publishedAt).toISOString(),
    remedyRecord: row.kind === 'note' && row.remedy ? (records.byRemedy.get(row.remedy) ?? null) : null,
  };
}

export interface Narrowed {
  /** the query's words as typed, each weighted by the rarity of what it was read as */
  words: WeightedWord[];
  readAs: Record<string, string[]>;
  candidates: RankedEntryRow[];
}

/** Steps 1–3: the words, how misspelt ones were read, and PostgreSQL's candidates. */
export async function narrow(q: string, filters: EntryFilters): Promise<Narrowed> {
  const typed = searchWordsOf(q);
  if (!typed.length) return { words: [], readAs: {}, candidates: [] };
  const [known, resolved] = await Promise.all([repo.knownWordsLike(typed, KNOWN_WORDS_PER_WORD, CONTAINING_PER_WORD, MIN_SIMILARITY), resolvedCaseCount()]);
  const readAs: Record<string, string[]> = {};
  const rankWords: RankWord[] = [];
  const words: WeightedWord[] = typed.map((word) => {
    // Best reading first (the query orders by similarity): the word itself when it is known.
    const similar = known.filter((k) => k.word === word);
    const corrections = similar.filter((k) => k.similarity < 1 && !k.term.includes(word));
    if (corrections.length && !similar.some((k) => k.term === word)) readAs[word] = corrections.map((k) => k.term);
    const own = similar.find((k) => k.term === word) ?? corrections[0];
    const idf = idfOf(resolved, own?.uses ?? 1);
    const readings = [{ term: word, score: 0 }, ...similar.filter((k) => k.term !== word).map((k) => ({ term: k.term, score: termScore(word, k.term) }))]
      .filter((r): r is { term: string; score: number } => r.score !== null)
      .sort((a, b) => a.score - b.score)
      .map((r) => ({ term: r.term, lnScore: Math.log(Math.max(r.score, FUSE_SCORE_FLOOR)) }));
    rankWords.push({ idf, readings });
    return { word, idf };
  });
  // Rare words narrow first (they weigh most in the ranking, and they pull in few rows); the
  // common ones fill what room is left. A word goes with all its readings, and its size is what
  // they pull in together; a word no case has counts as rare.
  const usesOf = new Map<string, number>(known.map((k) => [k.term, k.uses]));
  const groups = rankWords
    .map((w) => ({ terms: w.readings.map((r) => r.term), uses: w.readings.reduce((sum, r) => sum + (usesOf.get(r.term) ?? 1), 0) }))
    .sort((a, b) => a.uses - b.uses);
  const rare: string[] = [];
  const common: string[][] = [];
  let rows = 0;
  for (const group of groups) {
    if (rows + group.uses <= LIBRARY_TUNING.rowBudget) {
      rare.push(...group.terms);
      rows += group.uses;
    } else common.push(group.terms);
  }
  const allWords = [...new Set(rankWords.flatMap((w) => w.readings.map((r) => r.term)))];
  const cap = LIBRARY_TUNING.candidates;
  const found = () => candidates.map((c) => c.id);
  // Every entry holding a rare word, ranked in SQL on all the words.
  let candidates = await repo.matchHead(rankWords, rare, filters, cap, []);
  // Entries holding every common word: they outscore those holding one, and there are far fewer.
  if (candidates.length < cap && common.length >= 2 && LIBRARY_TUNING.everyCommonWordFirst) {
    candidates = [...candidates, ...(await repo.matchHead(rankWords, { all: common }, filters, cap - candidates.length, found()))];
  }
  // Then the entries the common words score best in, from their postings (never all their matches).
  if (candidates.length < cap && common.length) {
    candidates = [...candidates, ...(await repo.matchPostings(rankWords, filters, cap - candidates.length, LIBRARY_TUNING.perReading, found()))];
  }
  if (candidates.length < cap) {
    candidates = [...candidates, ...(await repo.matchBody(allWords, filters, candidates.map((c) => c.id), cap - candidates.length))];
  }
  if (candidates.length < FEW_MATCHES) {
    const seen = new Set(candidates.map((c) => c.id));
    const more = (await repo.matchTitleWords(typed, filters, cap)).filter((c) => !seen.has(c.id));
    candidates = [...candidates, ...more].slice(0, cap);
  }
  return { words, readAs, candidates };
}

export async function searchLibrary(query: LibraryQuery): Promise<LibraryList> {
  const filters: EntryFilters = { stage: query.stage, symptoms: query.symptom ?? [], kind: query.kind };
  const records = await getRemedyRecords();
  const { page, pageSize } = query;
  const q = query.q?.trim() ?? '';

  if (!q) {
    const order = records.list.map((r) => r.remedy);
    const { rows, total } = await repo.browse(filters, order, pageSize, (page - 1) * pageSize);
    return { items: rows.map((r) => toListItem(r, records)), total, page, pageSize, readAs: {}, remedyRecords: records.list };
  }

  const { words, readAs, candidates } = await narrow(q, filters);
  const quality = (row: EntryRow) => (row.kind === 'guide' ? GUIDE_QUALITY : row.remedy ? (records.byRemedy.get(row.remedy)?.lower ?? 0) : 0);
  const ranked = byScore(
    fuseScores(candidates, words).map((s) => ({ entry: s.entry, score: s.score - QUALITY_WEIGHT * quality(s.entry) })),
    (a, b) => b.rank - a.rank || new Date(b.publishedAt).getTime() - new Date(a.publishedAt).getTime(),
  );
  const start = (page - 1) * pageSize;
  return {
    items: ranked.slice(start, start + pageSize).map((s) => toListItem(s.entry, records)),
    total: ranked.length,
    page,
    pageSize,
    readAs,
    remedyRecords: records.list,
  };
}

interface NoteDetail {
  stars?: number | null;
  daysToResolve?: number | null;
  photos?: Array<{ id: number; width: number; height: number }>;
}

export function notePhotoUrls(slug: string, photoId: number): Pick<LibraryPhoto, 'url' | 'thumbUrl'> {
  return { url: `/api/library/${slug}/photos/${photoId}`, thumbUrl: `/api/library/${slug}/photos/${photoId}/thumb` };
}

export async function getLibraryEntry(slug: string): Promise<LibraryEntry> {
  if (!SLUG_PATTERN.test(slug)) throw notFound('That Field Library page');
  const row = await repo.findBySlug(slug);
  if (!row) throw notFound('That Field Library page');
  const records = await getRemedyRecords();
  const detail = row.detail as NoteDetail;
  return {
    ...toListItem(row, records),
    body: row.body,
    sources: row.sources,
    updatedAt: new Date(row.updatedAt).toISOString(),
    note:
      row.kind === 'note'
        ? {
            stars: detail.stars ?? null,
            daysToResolve: detail.daysToResolve ?? null,
            photos: (detail.photos ?? []).map((p) => ({ width: p.width, height: p.height, ...notePhotoUrls(row.slug, p.id) })),
          }
        : null,
  };
}

/** The case behind a field note (for a steward curating the library); a guide has none. */
export async function noteCaseId(slug: string): Promise<number> {
  if (!SLUG_PATTERN.test(slug)) throw notFound('That Field Library page');
  const row = await repo.findBySlug(slug);
  if (!row) throw notFound('That Field Library page');
  if (row.kind !== 'note' || !row.caseId) {
    throw conflict('guide_from_files', 'Guides come from the knowledge folder of Sporewell: change or remove the file there instead.');
  }
  return row.caseId;
}

/** The stored photo behind a field note's photo URL; only photos the note lists (the grower agreed). */
export async function notePhotoKey(slug: string, photoId: number, thumb: boolean): Promise<string> {
  if (!SLUG_PATTERN.test(slug)) throw notFound('That photo');
  const row = await repo.findBySlug(slug);
  const listed = ((row?.detail as NoteDetail | undefined)?.photos ?? []).some((p) => p.id === photoId);
  if (!row || row.kind !== 'note' || !row.caseId || !listed) throw notFound('That photo');
  const key = await repo.photoKey(row.caseId, photoId, thumb);
  if (!key) throw notFound('That photo');
  return key;
}
