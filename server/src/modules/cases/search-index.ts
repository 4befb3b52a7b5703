// What a case is found by: its search text (the generated `search` tsvector is built from it)
// and, once it is resolved, its words in search_terms, which is where a misspelt query word is
// corrected by trigram similarity and where a word's document frequency comes from.
//
// Words are cut the same way on both sides: lower case, split at anything that is not a-z,
// 3–30 letters, not in STOP_WORDS. The SQL in `indexResolvedCases` and `queryWords` below
// must stay in step (the test in tests/server/similar.test.ts checks a word round-trips).
import { QueryTypes, type Transaction } from 'sequelize';
import { getSequelize } from '../../db/sequelize';
import { CAUSES, REMEDIES, STAGES, SYMPTOMS, labelOf } from '../../../shared/vocabulary';
import { RESOLVED_STATUSES } from '../../../shared/case-status';

/** Words too common in any English text to tell two cases apart. */
export const STOP_WORDS: readonly string[] = [
  'the', 'and', 'for', 'are', 'but', 'not', 'you', 'all', 'any', 'can', 'had', 'her', 'was', 'one', 'our', 'out', 'has',
  'him', 'his', 'how', 'its', 'may', 'now', 'off', 'own', 'she', 'too', 'use', 'who', 'why', 'yet', 'did', 'get', 'got',
  'let', 'put', 'say', 'see', 'way', 'also', 'been', 'from', 'have', 'here', 'into', 'just', 'like', 'more', 'most', 'much',
  'only', 'over', 'some', 'such', 'than', 'that', 'them', 'then', 'they', 'this', 'very', 'were', 'what', 'when', 'will',
  'with', 'would', 'your', 'about', 'after', 'again', 'could', 'their', 'there', 'these', 'those', 'which', 'while',
  'other', 'should', 'because', 'before', 'being', 'does', 'doing', 'each', 'few', 'same', 'where', 'both', 'once', 'ours',
  'under', 'until', 'above', 'below', 'between', 'through', 'during', 'mine', 'myself', 'itself', 'know', 'think',
  // fillers of everyday speech: "lots of liquid", "quite a bit", "something odd"
  'lot', 'lots', 'bit', 'quite', 'really', 'rather', 'pretty', 'even', 'still', 'though', 'maybe', 'thing', 'things',
  'something', 'anything',
  // when it was noticed, which every draft says and no cause shares: "since yesterday", "worse today"
  'yesterday', 'today', 'tonight', 'tomorrow', 'since', 'ago',
  // how a change is told rather than what it is: "it started to", "I noticed", "it looks", "seems"
  'started', 'noticed', 'looks', 'look', 'seems', 'seemed',
];

const STOP = new Set(STOP_WORDS);
export const MIN_WORD = 3;
export const MAX_WORD = 30;

/** The distinct words of a text, in order of first appearance. */
export function queryWords(text: string): string[] {
  const seen = new Set<string>();
  for (const word of text.toLowerCase().split(/[^a-z]+/)) {
    if (word.length < MIN_WORD || word.length > MAX_WORD || STOP.has(word)) continue;
    seen.add(word);
  }
  return [...seen];
}

export interface SearchTextParts {
  title: string;
  description: string;
  stage: string;
  symptoms: readonly string[];
  cause?: string | null;
  causeNotes?: string | null;
  remedy?: string | null;
  remedyNotes?: string | null;
  summary?: string | null;
}

/** Title, description, stage and symptom words; once closed, also the cause, remedy and summary.
 * Labels rather than ids, so that "foaming" in a description meets "Bubbling or foaming". */
export function buildSearchText(parts: SearchTextParts): string {
  const stageWords = STAGES.find((s) => s.id === parts.stage) ? parts.stage : '';
  return [
    parts.title,
    parts.description,
    stageWords,
    parts.symptoms.map((s) => labelOf(SYMPTOMS, s)).join(', '),
    parts.cause ? labelOf(CAUSES, parts.cause) : '',
    parts.causeNotes ?? '',
    parts.remedy ? labelOf(REMEDIES, parts.remedy) : '',
    parts.remedyNotes ?? '',
    parts.summary ?? '',
  ]
    .map((s) => s.trim())
    .filter(Boolean)
    .join('\n');
}

const RESOLVED_SQL = RESOLVED_STATUSES.map((s) => `'${s}'`).join(', ');

/**
 * Counts the words of resolved cases in search_terms (`uses` = in how many resolved cases the
 * word appears). A case counts once: `terms_indexed` marks it, and indexing it again only adds
 * words it did not have before. `which` is a list of case ids, or 'all' for every resolved case
 * not yet counted (the demo seed and the benchmark).
 */
export async function indexResolvedCases(which: readonly number[] | 'all', transaction?: Transaction): Promise<number> {
  if (which !== 'all' && which.length === 0) return 0;
  const filter = which === 'all' ? 'NOT terms_indexed' : 'id = ANY($ids::int[])';
  const rows = await getSequelize().query<{ indexed: number }>(
    `WITH target AS (
       SELECT id, search_text, terms_indexed FROM cases
        WHERE status IN (${RESOLVED_SQL}) AND ${filter}
        FOR UPDATE
     ), words AS (
       SELECT DISTINCT t.id, t.terms_indexed, w AS term
         FROM target t, regexp_split_to_table(lower(t.search_text), '[^a-z]+') AS w
        WHERE char_length(w) BETWEEN ${MIN_WORD} AND ${MAX_WORD} AND w <> ALL($stop::text[])
     ), counted AS (
       SELECT term, count(*) FILTER (WHERE NOT terms_indexed) AS n FROM words GROUP BY term
     ), counted_anew AS (
       INSERT INTO search_terms (term, uses)
       SELECT term, n FROM counted WHERE n > 0
       ON CONFLICT (term) DO UPDATE SET uses = search_terms.uses + EXCLUDED.uses
       RETURNING 1
     ), known_already AS (
       -- words of a case counted before: known from now on, but not counted twice
       INSERT INTO search_terms (term, uses)
       SELECT term, 1 FROM counted WHERE n = 0
       ON CONFLICT (term) DO NOTHING
       RETURNING 1
     ), marked AS (
       UPDATE cases SET terms_indexed = true WHERE id IN (SELECT id FROM target) AND NOT terms_indexed RETURNING 1
     )
     SELECT (SELECT count(*) FROM marked)::int AS indexed`,
    { bind: { ids: which === 'all' ? [] : [...which], stop: [...STOP_WORDS] }, type: QueryTypes.SELECT, transaction },
  );
  return rows[0]?.indexed ?? 0;
}

/**
 * Call when a case becomes resolved (recovered or lost), in the same transaction: rewrites its
 * search text with the cause, remedy and summary, and counts its words in search_terms.
 * A case that is not resolved is left alone. Returns whether the case was resolved.
 */
export async function indexResolvedCase(caseId: number, transaction?: Transaction): Promise<boolean> {
  const sequelize = getSequelize();
  const rows = await sequelize.query<SearchTextParts & { status: string }>(
    `SELECT title, description, stage, symptoms, cause, cause_notes AS "causeNotes", remedy, remedy_notes AS "remedyNotes", summary, status
       FROM cases WHERE id = :caseId FOR UPDATE`,
    { replacements: { caseId }, type: QueryTypes.SELECT, transaction },
  );
  const row = rows[0];
  if (!row || !RESOLVED_STATUSES.includes(row.status as (typeof RESOLVED_STATUSES)[number])) return false;
  await sequelize.query(`UPDATE cases SET search_text = :text, updated_at = now() WHERE id = :caseId`, {
    replacements: { caseId, text: buildSearchText(row) },
    transaction,
  });
  await indexResolvedCases([caseId], transaction);
  return true;
}

/** The words one slip of the finger away from `word`: two neighbouring letters swapped
 * ("laeve" → "leave") or one letter dropped ("cloudyy" → "cloudy"). Trigram likeness misses the
 * swaps in short words ("cluody" is only 0.27 like "cloudy"), which fuse.js still matches. */
export function slipsOf(word: string): string[] {
  const out = new Set<string>();
  for (let i = 0; i + 1 < word.length; i++) {
    if (word[i] !== word[i + 1]) out.add(word.slice(0, i) + word[i + 1] + word[i] + word.slice(i + 2));
  }
  if (word.length > 3) for (let i = 0; i < word.length; i++) out.add(word.slice(0, i) + word.slice(i + 1));
  out.delete(word);
  return [...out];
}

/** Each word's slips as one comma-joined string, for `string_to_array(…, ',')` in SQL beside
 * `unnest` of the words (words from queryWords are a–z only, so a comma never occurs in one). */
export function slipLists(words: readonly string[]): string[] {
  return words.map((word) => slipsOf(word).join(','));
}
