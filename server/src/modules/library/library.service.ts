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
//    a looser, wider reading costs little here.
// 3. PostgreSQL full-text search (GIN) takes at most CANDIDATES entries that contain any of
//    those words, best text rank first, with the stage/symptom/kind filters applied. When that
//    finds almost nothing, titles with a trigram-similar word are added.
// 4. fuse.js scores the candidates against the words as typed (library-ranking.ts).
// 5. Best first: the fuse.js score, nudged by how well the entry's remedy holds up (the lower
//    bound of its Wilson interval; a guide counts as GUIDE_QUALITY). The nudge is at most
//    QUALITY_WEIGHT, so it reorders close matches and never lifts a poor match over a good one.
import type { Outcome } from '../../../shared/closing-schemas';
import type { LibraryEntry, LibraryList, LibraryListItem, LibraryPhoto, LibraryQuery, RemedyRecordView } from '../../../shared/library-schemas';
import { describeRecord, remedyRecords } from '../../../shared/remedy-records';
import { notFound } from '../../lib/errors';
import { queryWords } from '../cases/search-index';
import { byScore, fuseScores } from './library-ranking';
import { libraryRepository as repo, type EntryFilters, type EntryRow, type RankedEntryRow } from './library.repository';

export const CANDIDATES = 200;
const KNOWN_WORDS_PER_WORD = 3;
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
  words: string[];
  readAs: Record<string, string[]>;
  candidates: RankedEntryRow[];
}

/** Steps 1–3: the words, how misspelt ones were read, and PostgreSQL's candidates. */
export async function narrow(q: string, filters: EntryFilters): Promise<Narrowed> {
  const words = searchWordsOf(q);
  if (!words.length) return { words, readAs: {}, candidates: [] };
  const known = await repo.knownWordsLike(words, KNOWN_WORDS_PER_WORD, MIN_SIMILARITY);
  const readAs: Record<string, string[]> = {};
  for (const word of words) {
    const terms = known.filter((k) => k.word === word).map((k) => k.term);
    if (terms.length && !terms.includes(word)) readAs[word] = terms;
  }
  const allWords = [...new Set([...words, ...known.map((k) => k.term)])];
  let candidates = await repo.matchText(allWords, filters, CANDIDATES);
  if (candidates.length < FEW_MATCHES) {
    const seen = new Set(candidates.map((c) => c.id));
    const more = (await repo.matchTitleWords(words, filters, CANDIDATES)).filter((c) => !seen.has(c.id));
    candidates = [...candidates, ...more].slice(0, CANDIDATES);
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
