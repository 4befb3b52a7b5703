// "Batches like this": resolved cases (recovered or lost) close to a case or to an unsaved draft.
//
// The score of a resolved case against the draft (0–1, higher is closer):
//
//   score = 0.45 × text + 0.25 × symptoms + 0.20 × stage + 0.10 × ratio
//
//   text      Σ idf(word) × credit(word, case) / Σ idf(word) over the draft's words (title and
//             description, at most SIMILAR_TUNING.maxWords, the rarest kept), idf = ln(1 + resolved cases /
//             cases using the word). A word the resolved cases use is credited 1 when the case
//             has it (full-text match, so "bubbles" meets "bubbling"). A word no case uses is
//             taken as misspelt: its nearest known words by trigram similarity, and the known
//             words one slip away (two letters swapped or one dropped), are the shortlist;
//             fuse.js scores each against what was typed, and the case is credited with the
//             best-scoring shortlisted word it has (1 − fuse score / threshold).
//   symptoms  Jaccard overlap of the symptom sets (shared / all named by either).
//   stage     1 for the same stage, 0.5 for a related one (IMO1–IMO4; FPJ and FFJ; WCA and WCS).
//   ratio     sugar : culture closeness, 1 − |Δ| / 0.6, floored at 0; 0 when either lacks it.
//
// Cases under 0.15 are not shown (a similar ratio alone, say). Ties go to the newer case.
//
// How it stays fast (QUALITY.md: p95 ≤ 25 ms at 100,000 resolved cases): PostgreSQL narrows to
// at most 200 candidates, from two ends —
//   by structure: the resolved cases of the draft's stage whose symptom set is one of the
//     nearest few hundred to the draft's (Jaccard ≥ 0.4, at most two symptoms dropped or added;
//     symptoms are a bit mask, looked up in the covering index of migration 0101), best 100 by
//     the structural part;
//   by text: the cases holding the draft's rarer words (the GIN index on `search`, one lookup
//     per word, never reading the big tsvector), best 100 by text + structure; words so common
//     that together they would pull in more than SIMILAR_TUNING.textRowBudget cases are left
//     out of this end (they weigh little anyway) but still count in the score.
// The same query reads which of all the draft's words each candidate holds, and the score of
// the ≤ 200 candidates is then computed exactly here. scripts/bench-similar.ts measures
// the time and compares the top 5 with the same formula computed over every case, misspelt
// words matched by fuse.js over the whole vocabulary.
import Fuse from 'fuse.js';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../db/sequelize';
import { SYMPTOM_BIT_ORDER_0101 } from '../../db/migrations/0101-similar-structure';
import { preparedQuery } from './prepared-query';
import type { SimilarAnswer, SimilarCaseItem, SimilarNoteItem } from '../../../shared/case-schemas';
import { SYMPTOMS, labelOf, type StageId, type SymptomId } from '../../../shared/vocabulary';
import { queryWords, slipLists } from './search-index';

export const SIMILAR_WEIGHTS = { text: 0.45, symptoms: 0.25, stage: 0.2, ratio: 0.1 } as const;

export const SIMILAR_TUNING = {
  /** candidates from each end (structure, text) */
  perEnd: 100,
  /** the narrowing words may together match at most about this many cases */
  textRowBudget: 800,
  /** the draft's words that count, rarest first */
  maxWords: 10,
  /** known words offered for a misspelt one (trigram similarity ≥ pg_trgm's 0.3) */
  shortlist: 5,
  /** fuse.js threshold (0 exact … 1 anything); a shortlisted word further than this gets no credit */
  fuseThreshold: 0.4,
  /** …nor one whose length differs by more than this from what was typed */
  maxLengthDifference: 2,
  ratioSpan: 0.6,
  relatedStage: 0.5,
  minScore: 0.15,
} as const;

/** Bit i of `cases.symptom_bits` is this symptom (frozen by migration 0101). */
export const SYMPTOM_BIT_ORDER: readonly string[] = SYMPTOM_BIT_ORDER_0101;

/**
 * The symptom sets nearest to `mask` by Jaccard overlap, best first: the set itself, then with
 * up to two symptoms dropped (never all) and up to two added, down to MIN_PATTERN_JACCARD, at
 * most MAX_PATTERNS of them. (Plain numbers: the 26 symptoms fit in 31 bits.)
 */
export function nearSymptomSets(mask: number): number[] {
  const inside: number[] = [];
  const outside: number[] = [];
  for (let i = 0; i < SYMPTOM_BIT_ORDER.length; i++) (mask & (1 << i) ? inside : outside).push(1 << i);
  const k = inside.length;
  if (k === 0) return [];
  /** OR-ed subsets of `from` with 0…most members, with their sizes */
  const subsets = (from: number[], most: number): [number, number][] => {
    const out: [number, number][] = [[0, 0]];
    for (let i = 0; i < from.length; i++) {
      if (most >= 1) out.push([from[i], 1]);
      if (most >= 2) for (let j = i + 1; j < from.length; j++) out.push([from[i] | from[j], 2]);
    }
    return out;
  };
  const found: { set: number; jaccard: number }[] = [];
  for (const [dropped, d] of subsets(inside, Math.min(2, k - 1))) {
    for (const [added, a] of subsets(outside, 2)) {
      const jaccard = (k - d) / (k + a);
      if (jaccard >= MIN_PATTERN_JACCARD) found.push({ set: (mask & ~dropped) | added, jaccard });
    }
  }
  return found.sort((x, y) => y.jaccard - x.jaccard || x.set - y.set).slice(0, MAX_PATTERNS).map((f) => f.set);
}
const MIN_PATTERN_JACCARD = 0.4;
const MAX_PATTERNS = 400;
if (SYMPTOM_BIT_ORDER_0101.length > 31) throw new Error('symptom masks no longer fit in 31 bits: move nearSymptomSets to BigInt');

export function symptomsOfMask(mask: number): SymptomId[] {
  return SYMPTOM_BIT_ORDER.filter((_, i) => mask & (1 << i)) as SymptomId[];
}

export function symptomMask(symptoms: readonly string[]): number {
  let mask = 0;
  for (const s of symptoms) {
    const at = SYMPTOM_BIT_ORDER.indexOf(s);
    if (at >= 0) mask |= 1 << at;
  }
  return mask;
}

const FAMILIES: readonly (readonly StageId[])[] = [['IMO1', 'IMO2', 'IMO3', 'IMO4'], ['FPJ', 'FFJ'], ['WCA', 'WCS']];

export function relatedStages(stage: StageId): StageId[] {
  return (FAMILIES.find((f) => f.includes(stage)) ?? []).filter((s) => s !== stage);
}

export interface SimilarRequest {
  stage?: StageId | null;
  symptoms: readonly SymptomId[];
  text: string;
  ratio: number | null;
  excludeId?: number;
  limit: number;
  /** growers see only cases published with consent; mentors and stewards all resolved cases */
  publishedOnly: boolean;
}

/** A known word that stands for a draft word, with the credit a case holding it earns. */
export interface Alternative {
  term: string;
  uses: number;
  credit: number;
}

/** One word of the draft. */
export interface Unit {
  /** as typed */
  word: string;
  /** the known word it is read as (itself when known) */
  term: string;
  idf: number;
  alternatives: Alternative[];
}

/** What the score needs of a resolved case (what is shown of it is read for the few shown). */
export interface Candidate {
  id: number;
  stage: StageId;
  symptoms: SymptomId[];
  ratio: number | null;
  /** indices into `flattenAlternatives(units)` of the alternatives this case holds */
  matched: number[];
}

export interface Scored {
  candidate: Candidate;
  score: number;
  reasons: string[];
}

// ---------------------------------------------------------------------------------------------
// The draft's words

let resolvedCache: { at: number; count: number } | null = null;

/** How many resolved cases there are, for idf; a minute old at most, since it only weighs words. */
export async function resolvedCaseCount(): Promise<number> {
  if (resolvedCache && Date.now() - resolvedCache.at < 60_000) return resolvedCache.count;
  const [row] = await getSequelize().query<{ n: number }>(`SELECT count(*)::int AS n FROM cases WHERE status IN ('recovered', 'lost')`, {
    type: QueryTypes.SELECT,
  });
  resolvedCache = { at: Date.now(), count: row.n };
  return row.n;
}

export function forgetResolvedCount(): void {
  resolvedCache = null;
}

export const idfOf = (uses: number, resolved: number) => Math.log(1 + Math.max(resolved, uses, 1) / Math.max(uses, 1));

export const FUSE_WORD_OPTIONS = {
  includeScore: true,
  ignoreLocation: true,
  ignoreFieldNorm: true,
  isCaseSensitive: false,
  shouldSort: false,
  threshold: SIMILAR_TUNING.fuseThreshold,
} as const;

/**
 * fuse.js's verdict on known words as stand-ins for a misspelt one: credit 1 − score / threshold
 * for each it finds within the threshold and about the same length, best first (ties: the more
 * used word). `fuse` may be given, built over exactly `known` (the benchmark passes one over
 * the whole vocabulary).
 */
export function creditsFor(typed: string, known: readonly { term: string; uses: number }[], fuse?: Fuse<string>): Alternative[] {
  const index = fuse ?? new Fuse(known.map((k) => k.term), FUSE_WORD_OPTIONS);
  const found: Alternative[] = [];
  for (const result of index.search(typed)) {
    const k = known[result.refIndex];
    if (Math.abs(k.term.length - typed.length) > SIMILAR_TUNING.maxLengthDifference) continue;
    const credit = Math.max(0, 1 - (result.score ?? 1) / SIMILAR_TUNING.fuseThreshold);
    if (credit > 0) found.push({ term: k.term, uses: k.uses, credit });
  }
  return found.sort((a, b) => b.credit - a.credit || b.uses - a.uses || a.term.localeCompare(b.term));
}

/** Builds a unit from what was typed and its alternatives (none: the word is dropped). */
export function unitOf(word: string, alternatives: Alternative[], resolved: number): Unit | null {
  if (alternatives.length === 0) return null;
  const best = alternatives[0];
  return { word, term: best.term, idf: idfOf(best.uses, resolved), alternatives };
}

/** The draft's words, at most maxWords of them, rarest first, duplicates of one reading merged. */
export function keepUnits(units: (Unit | null)[]): Unit[] {
  const byTerm = new Map<string, Unit>();
  for (const unit of units) if (unit && !byTerm.has(unit.term)) byTerm.set(unit.term, unit);
  return [...byTerm.values()].sort((a, b) => b.idf - a.idf || a.term.localeCompare(b.term)).slice(0, SIMILAR_TUNING.maxWords);
}

export async function readUnits(text: string, resolved: number): Promise<Unit[]> {
  const words = queryWords(text).slice(0, 40);
  if (words.length === 0) return [];
  // Known words are looked up exactly; only unknown ones go to the trigram index, and to the
  // known words one slip away (slipsOf: "cluody" is only 0.27 like "cloudy" by trigrams).
  const rows = await preparedQuery<{ word: string; term: string; uses: number; exact: boolean }>(
    `SELECT q.word, s.term, s.uses, s.exact
       FROM unnest($words::text[], $slips::text[]) WITH ORDINALITY AS q(word, slips, ord)
       CROSS JOIN LATERAL (
         (SELECT term, uses, true AS exact FROM search_terms WHERE term = q.word)
         UNION
         (SELECT term, uses, false FROM search_terms
           WHERE NOT EXISTS (SELECT 1 FROM search_terms e WHERE e.term = q.word) AND term % q.word
           ORDER BY similarity(term, q.word) DESC, uses DESC, term LIMIT $shortlist)
         UNION
         (SELECT term, uses, false FROM search_terms
           WHERE NOT EXISTS (SELECT 1 FROM search_terms e WHERE e.term = q.word) AND term = ANY(string_to_array(q.slips, ','))
           ORDER BY uses DESC, term LIMIT $shortlist)
       ) s
      ORDER BY q.ord`,
    { words, slips: slipLists(words), shortlist: SIMILAR_TUNING.shortlist },
  );
  const byWord = new Map<string, { term: string; uses: number; exact: boolean }[]>();
  for (const row of rows) byWord.set(row.word, [...(byWord.get(row.word) ?? []), { ...row, uses: Number(row.uses) }]);
  const units = words.map((word) => {
    const found = byWord.get(word) ?? [];
    const exact = found.find((f) => f.exact);
    if (exact) return unitOf(word, [{ term: word, uses: exact.uses, credit: 1 }], resolved);
    return unitOf(word, creditsFor(word, found), resolved);
  });
  return keepUnits(units);
}

export function flattenAlternatives(units: readonly Unit[]): { unit: number; term: string; uses: number; credit: number }[] {
  return units.flatMap((u, unit) => u.alternatives.map((a) => ({ unit, ...a })));
}

/** The alternatives that narrow: rarest first, while together they stay within the row budget. */
export function narrowingAlternatives(units: readonly Unit[]): Set<number> {
  const all = flattenAlternatives(units).map((a, index) => ({ ...a, index }));
  const chosen = new Set<number>();
  let rows = 0;
  for (const alt of all.sort((a, b) => a.uses - b.uses || a.index - b.index)) {
    if (chosen.size > 0 && rows + alt.uses > SIMILAR_TUNING.textRowBudget) break;
    chosen.add(alt.index);
    rows += alt.uses;
  }
  return chosen;
}

// ---------------------------------------------------------------------------------------------
// PostgreSQL narrows

/** The structural part of the score in SQL, for a row `c` (the same sum as `structureOf` below). */
function structureSql(): string {
  const W = SIMILAR_WEIGHTS;
  const T = SIMILAR_TUNING;
  return `(${W.symptoms} * CASE WHEN $mask::bigint = 0 THEN 0
              ELSE bit_count((c.symptom_bits & $mask::bigint)::bit(64))::float8 / NULLIF(bit_count((c.symptom_bits | $mask::bigint)::bit(64)), 0) END
         + ${W.stage} * CASE WHEN c.stage = $stage::text THEN 1 WHEN c.stage = ANY($family::text[]) THEN ${T.relatedStage} ELSE 0 END
         + ${W.ratio} * CASE WHEN $ratio::float8 IS NULL OR c.sugar_ratio IS NULL THEN 0
              ELSE GREATEST(0, 1 - abs(c.sugar_ratio - $ratio::float8) / ${T.ratioSpan}) END)`;
}

const VISIBLE = `c.status IN ('recovered', 'lost') AND c.id <> $exclude::int AND (NOT $publishedOnly::boolean OR c.published)`;

export async function findCandidates(request: SimilarRequest, units: readonly Unit[]): Promise<Candidate[]> {
  const stage = request.stage ?? null;
  const mask = symptomMask(request.symptoms);
  const alternatives = flattenAlternatives(units);
  const narrowing = narrowingAlternatives(units);
  const idfTotal = units.reduce((sum, u) => sum + u.idf, 0) || 1;
  const ends: string[] = [];
  if (narrowing.size > 0) {
    ends.push(`(SELECT id FROM (
        SELECT h.id, ${SIMILAR_WEIGHTS.text} * sum(h.credit * u.idf) / $idfTotal::float8 + max(h.structure) AS approx
          FROM (SELECT c.id, a.unit, max(a.credit) AS credit, ${structureSql()} AS structure
                  FROM alts a JOIN cases c ON c.search @@ a.q
                 WHERE a.narrow AND ${VISIBLE}
                 GROUP BY c.id, a.unit, c.symptom_bits, c.stage, c.sugar_ratio) h
          JOIN unnest($unitIdf::float8[]) WITH ORDINALITY AS u(idf, unit) ON u.unit - 1 = h.unit
         GROUP BY h.id
         ORDER BY approx DESC, h.id DESC LIMIT $perEnd::int) t)`);
  }
  if (stage) {
    ends.push(`(SELECT c.id FROM cases c
        WHERE ${VISIBLE} AND c.stage = $stage::text ${mask ? 'AND c.symptom_bits = ANY($near::bigint[])' : ''}
        ORDER BY ${structureSql()} DESC, c.id DESC LIMIT $perEnd::int)`);
  } else if (request.symptoms.length >= 2) {
    ends.push(`(SELECT c.id FROM cases c
        WHERE ${VISIBLE} AND c.symptoms @> $symptoms::text[]
        ORDER BY ${structureSql()} DESC, c.id DESC LIMIT $perEnd::int)`);
  }
  if (ends.length === 0) return [];
  const rows = await preparedQuery<{ id: number; stage: StageId; bits: number; ratio: number | null; matched: number[] | null }>(
    `WITH alts AS MATERIALIZED (
       SELECT a.k, a.unit, a.credit, a.narrow, q
         FROM unnest($altTerms::text[], $altUnits::int[], $altCredits::float8[], $altNarrow::boolean[]) WITH ORDINALITY AS a(term, unit, credit, narrow, k),
              to_tsquery('english', a.term) AS q
        WHERE numnode(q) > 0
     ), picked AS (${ends.join(' UNION ')})
     SELECT c.id, c.stage, c.symptom_bits::int AS bits, c.sugar_ratio AS ratio,
            ARRAY(SELECT a.k - 1 FROM alts a WHERE d.v @@ a.q ORDER BY a.k) AS matched
       FROM picked p
       JOIN cases c ON c.id = p.id
       -- one copy of the tsvector per row, instead of fetching it again for every word
       CROSS JOIN LATERAL (SELECT c.search || ''::tsvector AS v OFFSET 0) d`,
    // Named, so what an end does not use is simply not sent.
    {
        altTerms: alternatives.map((a) => a.term),
        altUnits: alternatives.map((a) => a.unit),
        altCredits: alternatives.map((a) => a.credit),
        altNarrow: alternatives.map((_, i) => narrowing.has(i)),
        unitIdf: units.map((u) => u.idf),
        idfTotal,
        stage,
        family: stage ? relatedStages(stage) : [],
        mask: mask.toString(),
        near: nearSymptomSets(mask).map(String),
        symptoms: [...request.symptoms],
        ratio: request.ratio,
        exclude: request.excludeId ?? 0,
        publishedOnly: request.publishedOnly,
        perEnd: SIMILAR_TUNING.perEnd,
    },
  );
  return rows.map((r) => ({ id: r.id, stage: r.stage, symptoms: symptomsOfMask(r.bits), ratio: r.ratio, matched: r.matched ?? [] }));
}

// ---------------------------------------------------------------------------------------------
// The exact score

function stageScore(draft: StageId | null | undefined, other: StageId): number {
  if (!draft) return 0;
  if (draft === other) return 1;
  return relatedStages(draft).includes(other) ? SIMILAR_TUNING.relatedStage : 0;
}

const symptomWords = (ids: readonly string[]) => ids.map((id) => labelOf(SYMPTOMS, id).toLowerCase()).join(', ');

/** Scores candidates with the formula at the top of this file, best first, at most `limit`. */
export function rankCandidates(
  request: Pick<SimilarRequest, 'stage' | 'symptoms' | 'ratio' | 'limit'>,
  units: readonly Unit[],
  candidates: readonly Candidate[],
  /** how a matched word is named in the reasons: the known word it was read as, or the draft's word as typed */
  wordsAs: 'reading' | 'typed' = 'reading',
): Scored[] {
  const W = SIMILAR_WEIGHTS;
  const alternatives = flattenAlternatives(units);
  const idfTotal = units.reduce((sum, u) => sum + u.idf, 0);
  const draftSymptoms = new Set(request.symptoms);
  const scored: Scored[] = [];
  for (const candidate of candidates) {
    const best = new Map<number, { credit: number; term: string }>();
    for (const index of candidate.matched) {
      const alt = alternatives[index];
      if (!alt) continue;
      const held = best.get(alt.unit);
      if (!held || alt.credit > held.credit) best.set(alt.unit, { credit: alt.credit, term: alt.term });
    }
    let textPart = 0;
    const mentioned: { term: string; weight: number }[] = [];
    for (const [unit, hit] of best) {
      textPart += units[unit].idf * hit.credit;
      if (hit.credit >= 0.5) mentioned.push({ term: wordsAs === 'typed' ? units[unit].word : hit.term, weight: units[unit].idf * hit.credit });
    }
    const text = idfTotal > 0 ? textPart / idfTotal : 0;
    // in the draft's order, as the grower named them
    const caseSymptoms = new Set(candidate.symptoms);
    const shared = [...draftSymptoms].filter((s) => caseSymptoms.has(s));
    const union = new Set([...candidate.symptoms, ...draftSymptoms]).size;
    const symptoms = draftSymptoms.size && union ? shared.length / union : 0;
    const stage = stageScore(request.stage, candidate.stage);
    const ratio =
      request.ratio === null || candidate.ratio === null ? 0 : Math.max(0, 1 - Math.abs(candidate.ratio - request.ratio) / SIMILAR_TUNING.ratioSpan);
    const score = W.text * text + W.symptoms * symptoms + W.stage * stage + W.ratio * ratio;
    if (score < SIMILAR_TUNING.minScore) continue;

    const reasons: { weight: number; text: string }[] = [];
    if (stage === 1) reasons.push({ weight: W.stage, text: `Same stage (${candidate.stage})` });
    else if (stage > 0) reasons.push({ weight: W.stage * stage, text: `A related stage (${candidate.stage})` });
    if (shared.length) {
      reasons.push({
        weight: W.symptoms * symptoms,
        text: `Shares ${shared.length === 1 ? 'a symptom' : `${shared.length} symptoms`}: ${symptomWords(shared)}`,
      });
    }
    if (mentioned.length) {
      const words = mentioned.sort((a, b) => b.weight - a.weight).slice(0, 4).map((m) => m.term);
      reasons.push({ weight: W.text * text, text: `Mentions ${words.join(', ')}` });
    }
    if (ratio >= 0.5 && candidate.ratio !== null) {
      reasons.push({ weight: W.ratio * ratio, text: `A similar sugar ratio (${candidate.ratio.toFixed(2)} : 1)` });
    }
    scored.push({ candidate, score, reasons: reasons.sort((a, b) => b.weight - a.weight).map((r) => r.text) });
  }
  return scored.sort((a, b) => b.score - a.score || b.candidate.id - a.candidate.id).slice(0, request.limit);
}

export interface SimilarCaseAnswer {
  items: SimilarCaseItem[];
  /** the words that counted, and what a misspelt one was read as */
  terms: { word: string; term: string }[];
}

type ShownCase = Omit<SimilarCaseItem, 'kind' | 'score' | 'reasons' | 'stage'>;

async function rankSimilar(request: SimilarRequest, wordsAs: 'reading' | 'typed'): Promise<{ units: Unit[]; ranked: Scored[] }> {
  const resolved = await resolvedCaseCount();
  const units = await readUnits(request.text, resolved);
  const candidates = await findCandidates(request, units);
  return { units, ranked: rankCandidates(request, units, candidates, wordsAs) };
}

const rounded = (score: number) => Math.round(score * 1000) / 1000;

/** Mentors' and stewards' view (and the benchmark's): the resolved cases themselves. */
export async function findSimilarCases(request: SimilarRequest): Promise<SimilarCaseAnswer> {
  const { units, ranked } = await rankSimilar(request, 'reading');
  const shown = ranked.length
    ? await preparedQuery<ShownCase>(
        `SELECT id, title, symptoms, cause, remedy, outcome, status, published FROM cases WHERE id = ANY($ids::int[])`,
        { ids: ranked.map((r) => r.candidate.id) },
      )
    : [];
  const byId = new Map(shown.map((row) => [row.id, row]));
  const items = ranked.flatMap((r): SimilarCaseItem[] => {
    const row = byId.get(r.candidate.id);
    return row ? [{ kind: 'case', ...row, stage: r.candidate.stage, score: rounded(r.score), reasons: r.reasons }] : [];
  });
  return { items, terms: units.map((u) => ({ word: u.word, term: u.term })) };
}

interface NoteRow {
  caseId: number;
  slug: string;
  title: string;
  summary: string;
  symptoms: SimilarNoteItem['symptoms'];
  cause: SimilarNoteItem['cause'];
  remedy: SimilarNoteItem['remedy'];
  outcome: SimilarNoteItem['outcome'];
}

/**
 * A grower's view: published cases only, each shown as its field note, read from the library's
 * anonymised copy; no case id, title or text of another grower leaves the server. The words are
 * credited from the note's own text, not the case's: a name or place the note leaves out must not
 * lift a note, or be named in its reasons, or a grower could probe another grower's private text
 * by typing it. For the same reason the words named (reasons, `terms`) are the grower's own as
 * typed, and `terms` lists only words some shown note holds: a reading of a misspelt word comes
 * from every resolved case's words, published or not.
 * (A published case whose note is not written yet, e.g. just after start-up, is left out.)
 */
export async function findSimilarNotes(request: Omit<SimilarRequest, 'publishedOnly'>): Promise<SimilarAnswer> {
  const withPublished = { ...request, publishedOnly: true };
  const resolved = await resolvedCaseCount();
  const units = await readUnits(request.text, resolved);
  const candidates = await findCandidates(withPublished, units);
  const alternatives = flattenAlternatives(units);
  const notes = candidates.length
    ? await preparedQuery<NoteRow & { matched: number[] | null }>(
        `SELECT e.case_id AS "caseId", e.slug, e.title, e.summary, e.symptoms, e.cause, e.remedy, e.outcome,
                ARRAY(SELECT a.k - 1
                        FROM unnest($altTerms::text[]) WITH ORDINALITY AS a(term, k), to_tsquery('english', a.term) AS q
                       WHERE numnode(q) > 0 AND e.search @@ q ORDER BY a.k) AS matched
           FROM library_entries e WHERE e.kind = 'note' AND e.case_id = ANY($ids::int[])`,
        { ids: candidates.map((c) => c.id), altTerms: alternatives.map((a) => a.term) },
      )
    : [];
  const byCase = new Map(notes.map((row) => [row.caseId, row]));
  const public_ = candidates.flatMap((c) => {
    const note = byCase.get(c.id);
    return note ? [{ ...c, matched: note.matched ?? [] }] : [];
  });
  const ranked = rankCandidates(withPublished, units, public_, 'typed');
  const credited = new Set(ranked.flatMap((r) => r.candidate.matched.map((i) => alternatives[i]?.unit)));
  const items = ranked.map((r): SimilarNoteItem => {
    const { caseId: _caseId, matched: _matched, ...shown } = byCase.get(r.candidate.id)!;
    return { kind: 'note', ...shown, stage: r.candidate.stage, score: rounded(r.score), reasons: r.reasons };
  });
  return { items, terms: units.flatMap((u, unit) => (credited.has(unit) ? [{ word: u.word, term: u.word }] : [])) };
}

/** Who sees what: growers the field notes, mentors and stewards the cases. */
export function findSimilarFor(user: Pick<Express.User, 'role'>, request: Omit<SimilarRequest, 'publishedOnly'>): Promise<SimilarAnswer> {
  return user.role === 'grower' ? findSimilarNotes(request) : findSimilarCases({ ...request, publishedOnly: false });
}
