// The Field Library's storage: guides and field notes in library_entries, the known words in
// search_terms that misspelt query words are read as, and the outcome counts behind the remedy
// track records. Raw SQL with bind parameters; plain camelCase objects out.
import { QueryTypes, type Transaction } from 'sequelize';
import type { LibraryKind, LibraryListItem } from '../../../shared/library-schemas';
import type { OutcomeCounts } from '../../../shared/remedy-records';
import { getSequelize } from '../../db/sequelize';
import { slipLists } from '../cases/search-index';
import { RANKED_FIELDS } from './library-ranking';

/** A list item as stored: the id, and the date as PostgreSQL gives it. */
export type EntryRow = Omit<LibraryListItem, 'publishedAt' | 'remedyRecord'> & { id: number; publishedAt: Date };

export interface RankedEntryRow extends EntryRow {
  /** PostgreSQL's text rank (ts_rank_cd), 0 for a title-only trigram match */
  rank: number;
}

export interface FullEntryRow extends EntryRow {
  caseId: number | null;
  body: string;
  sources: string[];
  detail: Record<string, unknown>;
  updatedAt: Date;
}

export interface EntryFilters {
  stage?: string;
  symptoms: readonly string[];
  kind?: LibraryKind;
}

const LIST_COLUMNS = `e.id, e.slug, e.kind, e.title, e.summary, e.stages, e.symptoms, e.cause, e.remedy, e.outcome, e.published_at AS "publishedAt"`;

/** The WHERE conditions for the filters, with their values appended to `bind` ($n placeholders). */
function filterSql(filters: EntryFilters, bind: unknown[]): string {
  const parts: string[] = [];
  if (filters.stage) {
    bind.push([filters.stage]);
    parts.push(`e.stages @> $${bind.length}::text[]`);
  }
  if (filters.symptoms.length) {
    bind.push([...filters.symptoms]);
    parts.push(`e.symptoms @> $${bind.length}::text[]`);
  }
  if (filters.kind) {
    bind.push(filters.kind);
    parts.push(`e.kind = $${bind.length}`);
  }
  return parts.length ? `AND ${parts.join(' AND ')}` : '';
}

/** A query word for ranking: its weight, and what it may be read as in a field, each with the
 * natural log of the score fuse.js gives that reading (an exact match scores 0.001 there). */
export interface RankWord {
  idf: number;
  readings: ReadonlyArray<{ term: string; lnScore: number }>;
}

function literal(x: number): string {
  if (!Number.isFinite(x)) throw new RangeError(`not a finite number: ${x}`);
  return x.toFixed(12);
}

/**
 * The rank: Σ over words of idf · (1 − fuse's score of the word in the entry), with that score
 * = exp(Σ over fields of weight · norm · ln s), s the best reading found in the field (fields
 * where none is found add 0, so a word found nowhere scores 1 and gains nothing). Terms go in as
 * bind parameters; only the computed numbers are written into the SQL.
 */
function rankSql(words: readonly RankWord[], bind: unknown[]): { from: string; expression: string } {
  const aliases = new Map<string, string>();
  const queries: string[] = [];
  for (const word of words) {
    for (const { term } of word.readings) {
      if (aliases.has(term)) continue;
      bind.push(term);
      const alias = `r${aliases.size}`;
      aliases.set(term, alias);
      queries.push(`websearch_to_tsquery('simple', $${bind.length}) AS ${alias}`);
    }
  }
  const gains = words.map((word) => {
    const exponent = RANKED_FIELDS.map(({ field, weight }) => {
      // float8 throughout: a numeric CASE would be converted to float8 on every row (through text).
      const found = word.readings.map((r) => `WHEN e.${field}_tsv @@ rq.${aliases.get(r.term)} THEN ${literal(r.lnScore)}::float8`).join(' ');
      return `${literal(weight)}::float8 * e.${field}_norm * (CASE ${found} ELSE 0::float8 END)`;
    }).join(' + ');
    return `${literal(word.idf)} * (1 - exp(${exponent}))`;
  });
  return { from: `(SELECT ${queries.join(', ')}) AS rq`, expression: gains.join(' + ') || '0' };
}

export const libraryRepository = {
  /** Each query word's closest known words (trigram similarity over search_terms), best first,
   * and known words that contain it (fuse.js finds a word inside a longer one as an exact match). */
  async knownWordsLike(
    words: readonly string[],
    perWord: number,
    containingPerWord: number,
    minSimilarity: number,
  ): Promise<Array<{ word: string; term: string; similarity: number; uses: number }>> {
    if (!words.length) return [];
    return getSequelize().query(
      `SELECT w.word, s.term, s.similarity, s.uses
         FROM unnest($1::text[], $5::text[]) AS w(word, slips)
         CROSS JOIN LATERAL (
           (SELECT t.term, t.uses, similarity(t.term, w.word) AS similarity
              FROM search_terms t
             WHERE t.term % w.word AND similarity(t.term, w.word) >= $3
             ORDER BY similarity(t.term, w.word) DESC, t.uses DESC, t.term
             LIMIT $2)
           UNION
           (SELECT t.term, t.uses, similarity(t.term, w.word) AS similarity
              FROM search_terms t
             WHERE t.term LIKE '%' || w.word || '%' AND t.term <> w.word
             ORDER BY t.uses DESC, t.term
             LIMIT $4)
           UNION
           (SELECT t.term, t.uses, similarity(t.term, w.word) AS similarity
              FROM search_terms t
             WHERE t.term = ANY(string_to_array(w.slips, ','))
             ORDER BY t.uses DESC, t.term
             LIMIT $2)
         ) s
        ORDER BY w.word, s.similarity DESC, s.uses DESC`,
      { bind: [[...words], perWord, minSimilarity, containingPerWord, slipLists(words)], type: QueryTypes.SELECT },
    );
  },

  /** PostgreSQL narrows: entries whose title, summary or labels contain any of `narrowing`, or
   * a word of every one of its `all` groups (as written: GIN of migration 0305), ranked the way
   * fuse.js will score them (rankSql), best first. */
  async matchHead(
    words: readonly RankWord[],
    narrowing: readonly string[] | { all: ReadonlyArray<readonly string[]> },
    filters: EntryFilters,
    cap: number,
    exclude: readonly number[],
  ): Promise<RankedEntryRow[]> {
    const groups = Array.isArray(narrowing) ? [narrowing as readonly string[]] : (narrowing as { all: ReadonlyArray<readonly string[]> }).all;
    if (!groups.length || groups.some((g) => !g.length) || !words.length || cap <= 0) return [];
    // Any word of a group, every group: (a or b) and (c or d). The words are a–z only, so
    // spelling the query out for to_tsquery is safe.
    const match = groups.map((g) => `(${g.join(' | ')})`).join(' & ');
    if (/[^a-z()|& ]/.test(match)) throw new RangeError('search words must be a-z');
    const bind: unknown[] = [match, cap, [...exclude]];
    const rank = rankSql(words, bind);
    const where = filterSql(filters, bind);
    return getSequelize().query<RankedEntryRow>(
      `SELECT ${LIST_COLUMNS}, (${rank.expression})::float8 AS rank
         FROM library_entries e, to_tsquery('simple', $1) AS q(query), ${rank.from}
        WHERE (e.title_tsv || e.summary_tsv || e.labels_tsv) @@ q.query AND e.id <> ALL($3::int[]) ${where}
        ORDER BY rank DESC, e.id DESC
        LIMIT $2`,
      { bind, type: QueryTypes.SELECT },
    );
  },

  /**
   * PostgreSQL narrows by postings (migration 0304): for each reading of each word, its
   * `perReading` strongest entries (an index-only range scan, filters checked on the index),
   * scored the way `matchHead` ranks: per field the best reading found there, fields added up,
   * words added up by idf. A word whose lists leave an entry out gains nothing from it here:
   * this picks candidates, fuse.js then scores them exactly.
   */
  async matchPostings(
    words: readonly RankWord[],
    filters: EntryFilters,
    cap: number,
    perReading: number,
    exclude: readonly number[],
  ): Promise<RankedEntryRow[]> {
    const readings = words.flatMap((word, index) => word.readings.map((r) => ({ ...r, word: index + 1 })));
    if (!readings.length || cap <= 0) return [];
    const bind: unknown[] = [
      readings.map((r) => r.term),
      readings.map((r) => r.word),
      readings.map((r) => r.lnScore),
      words.map((w) => w.idf),
      cap,
      perReading,
      [...exclude],
    ];
    // A posting carries the entry's kind, stages and symptoms under the same names, so the
    // filters apply to it as to an entry (alias `e`).
    const where = filterSql(filters, bind);
    return getSequelize().query<RankedEntryRow>(
      `WITH hits AS (
         SELECT r.word, p.entry_id,
                min(r.ln * p.title_impact) + min(r.ln * p.summary_impact) + min(r.ln * p.labels_impact) AS exponent
           FROM unnest($1::text[], $2::int[], $3::float8[]) AS r(term, word, ln)
           CROSS JOIN LATERAL (
             SELECT e.entry_id, e.title_impact, e.summary_impact, e.labels_impact FROM library_postings e
              WHERE e.term = r.term AND e.entry_id <> ALL($7::int[]) ${where}
              ORDER BY e.impact DESC, e.entry_id DESC
              LIMIT $6) p
          GROUP BY r.word, p.entry_id
       ), scored AS (
         SELECT h.entry_id, sum(i.idf * (1 - exp(h.exponent))) AS rank
           FROM hits h JOIN unnest($4::float8[]) WITH ORDINALITY AS i(idf, word) ON i.word = h.word
          GROUP BY h.entry_id
          ORDER BY rank DESC, h.entry_id DESC
          LIMIT $5
       )
       SELECT ${LIST_COLUMNS}, s.rank::float8 AS rank
         FROM scored s JOIN library_entries e ON e.id = s.entry_id
        ORDER BY s.rank DESC, e.id DESC`,
      { bind, type: QueryTypes.SELECT },
    );
  },

  /** More entries that name a word only in their body (a guide's text, a note's details). Not
   * ranked in SQL: this runs only when the head found few, and fuse.js ranks what it adds. */
  async matchBody(words: readonly string[], filters: EntryFilters, exclude: readonly number[], limit: number): Promise<RankedEntryRow[]> {
    if (!words.length || limit <= 0) return [];
    const bind: unknown[] = [words.join(' or '), limit, [...exclude]];
    const where = filterSql(filters, bind);
    return getSequelize().query<RankedEntryRow>(
      `SELECT ${LIST_COLUMNS}, 0::float8 AS rank
         FROM library_entries e, websearch_to_tsquery('english', $1) AS q(query)
        WHERE e.search @@ q.query AND e.id <> ALL($3::int[]) ${where}
        ORDER BY e.id DESC
        LIMIT $2`,
      { bind, type: QueryTypes.SELECT },
    );
  },

  /** For a word no known term corrects: titles that contain something like it (trigram index). */
  async matchTitleWords(words: readonly string[], filters: EntryFilters, cap: number): Promise<RankedEntryRow[]> {
    if (!words.length) return [];
    const bind: unknown[] = [[...words], cap];
    const where = filterSql(filters, bind);
    return getSequelize().query<RankedEntryRow>(
      `SELECT ${LIST_COLUMNS}, 0::float8 AS rank
         FROM library_entries e
        WHERE EXISTS (SELECT 1 FROM unnest($1::text[]) AS w(word) WHERE w.word <% lower(e.title)) ${where}
        ORDER BY e.published_at DESC, e.id DESC
        LIMIT $2`,
      { bind, type: QueryTypes.SELECT },
    );
  },

  /** Browsing without words: guides first, then notes by their remedy's place in `remedyOrder`
   * (best lower bound first), newest first within a remedy. */
  async browse(filters: EntryFilters, remedyOrder: readonly string[], limit: number, offset: number): Promise<{ rows: EntryRow[]; total: number }> {
    const bind: unknown[] = [[...remedyOrder], limit, offset];
    const where = filterSql(filters, bind);
    const sequelize = getSequelize();
    const rows = await sequelize.query<EntryRow>(
      `SELECT ${LIST_COLUMNS}
         FROM library_entries e
        WHERE true ${where}
        ORDER BY (e.kind = 'guide') DESC, array_position($1::text[], e.remedy) NULLS LAST, e.published_at DESC, e.id DESC
        LIMIT $2 OFFSET $3`,
      { bind, type: QueryTypes.SELECT },
    );
    const countBind: unknown[] = [];
    const countWhere = filterSql(filters, countBind);
    const [count] = await sequelize.query<{ total: number }>(`SELECT count(*)::int AS total FROM library_entries e WHERE true ${countWhere}`, {
      bind: countBind,
      type: QueryTypes.SELECT,
    });
    return { rows, total: count?.total ?? 0 };
  },

  async findBySlug(slug: string): Promise<FullEntryRow | null> {
    const rows = await getSequelize().query<FullEntryRow>(
      `SELECT ${LIST_COLUMNS}, e.case_id AS "caseId", e.body, e.sources, e.detail, e.updated_at AS "updatedAt"
         FROM library_entries e WHERE e.slug = $1`,
      { bind: [slug], type: QueryTypes.SELECT },
    );
    return rows[0] ?? null;
  },

  async photoKey(caseId: number, photoId: number, thumb: boolean): Promise<string | null> {
    const rows = await getSequelize().query<{ key: string }>(
      `SELECT CASE WHEN $3 THEN thumb_key ELSE storage_key END AS key FROM case_photos WHERE id = $1 AND case_id = $2`,
      { bind: [photoId, caseId, thumb], type: QueryTypes.SELECT },
    );
    return rows[0]?.key ?? null;
  },

  /** Recovery reports per remedy: what the remedy track records are computed from. */
  async outcomeCountsByRemedy(transaction?: Transaction): Promise<Array<OutcomeCounts & { remedy: string }>> {
    return getSequelize().query(
      `SELECT remedy,
              count(*) FILTER (WHERE outcome = 'recovered')::int AS recovered,
              count(*) FILTER (WHERE outcome = 'partly')::int AS partly,
              count(*) FILTER (WHERE outcome = 'lost')::int AS lost,
              COALESCE(sum(stars), 0)::int AS "starsSum",
              count(stars)::int AS "starsCount"
         FROM cases
        WHERE outcome IS NOT NULL AND remedy IS NOT NULL
        GROUP BY remedy`,
      { type: QueryTypes.SELECT, transaction },
    );
  },
};
