// "Batches like this": resolved cases (recovered or lost) close to a case or to an unsaved draft.
//
// How a resolved case is scored against the draft (0–1, higher is closer):
//
//   score = 0.45 × text + 0.25 × symptoms + 0.20 × stage + 0.10 × ratio
//
//   text      the draft's words (title and description), each corrected against the words of
//             resolved cases (search_terms, trigram similarity), weighted by rarity
//             (idf = ln(1 + resolved cases / cases with the word)); a word counts by how well
//             fuse.js finds it in the case's search text (1 for an exact hit, falling to 0 at
//             fuse's threshold): text = Σ idf × hit / Σ idf.
//   symptoms  Jaccard overlap of the symptom sets (shared / all named by either).
//   stage     1 for the same stage, 0.5 for a related one (IMO1–IMO4; FPJ and FFJ; WCA and WCS).
//   ratio     sugar : culture closeness, 1 − |Δ| / 0.6, floored at 0; 0 when either lacks it.
//
// Cases under 0.15 are not shown (nothing but a similar ratio, say). Ties go to the newer case.
//
// Why two steps: fuse.js over every resolved case takes seconds at 100,000 (QUALITY.md), so
// PostgreSQL first narrows to at most 200 candidates, ranked by the same formula with exact
// full-text hits standing in for fuse's fuzzy ones: rows that contain one of the draft's rarer
// words (GIN on `search`; words so common that together they would pull in more than
// TEXT_ROW_BUDGET rows are left to the ranking step, they weigh little anyway), or that share
// the stage and a symptom (GIN on symptoms + the resolved-stage index). fuse.js then ranks that
// short list. scripts/bench-similar.ts measures the time and how often the top 5 equal the
// same formula computed with fuse.js over all cases.
import Fuse from 'fuse.js';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../db/sequelize';
import type { SimilarItem } from '../../../shared/case-schemas';
import { SYMPTOMS, labelOf, type StageId, type SymptomId } from '../../../shared/vocabulary';
import { queryWords } from './search-index';

export const SIMILAR_WEIGHTS = { text: 0.45, symptoms: 0.25, stage: 0.2, ratio: 0.1 } as const;

export const SIMILAR_TUNING = {
  /** candidates PostgreSQL hands to fuse.js */
  candidateLimit: 200,
  /** the narrowing words may together match at most about this many rows */
  textRowBudget: 4000,
  /** the draft's rarest words that count; the rest add little and cost time */
  maxTerms: 10,
  /** fuse.js threshold (0 exact … 1 anything) */
  fuseThreshold: 0.4,
  /** a misspelt word is replaced by a known word at least this trigram-similar */
  minCorrection: 0.4,
  ratioSpan: 0.6,
  relatedStage: 0.5,
  minScore: 0.15,
} as const;

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

export interface Term {
  /** what the draft said */
  word: string;
  /** the known word it stands for (the same word when spelt as some case spells it) */
  term: string;
  uses: number;
  idf: number;
}

export interface Candidate extends Omit<SimilarItem, 'score' | 'reasons'> {
  ratio: number | null;
  text: string;
}

export interface Scored {
  candidate: Candidate;
  score: number;
  reasons: string[];
}

// ---------------------------------------------------------------------------------------------
// Step 0: the draft's words, corrected, with their weight

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

/** Each word, matched to the most similar known word (itself when known), rarest first. */
export async function correctedTerms(text: string, resolved: number): Promise<Term[]> {
  const words = queryWords(text).slice(0, 40);
  if (words.length === 0) return [];
  const rows = await getSequelize().query<{ word: string; term: string; uses: number }>(
    `SELECT q.word, t.term, t.uses
       FROM unnest($words::text[]) WITH ORDINALITY AS q(word, ord)
       CROSS JOIN LATERAL (
         SELECT term, uses, similarity(term, q.word) AS sim FROM search_terms
          WHERE term % q.word AND similarity(term, q.word) >= $min
          ORDER BY sim DESC, uses DESC, term LIMIT 1
       ) t
      ORDER BY q.ord`,
    { bind: { words, min: SIMILAR_TUNING.minCorrection }, type: QueryTypes.SELECT },
  );
  const byTerm = new Map<string, Term>();
  for (const row of rows) {
    if (byTerm.has(row.term)) continue;
    const uses = Math.max(1, Number(row.uses));
    byTerm.set(row.term, { word: row.word, term: row.term, uses, idf: Math.log(1 + Math.max(resolved, uses) / uses) });
  }
  return [...byTerm.values()].sort((a, b) => b.idf - a.idf || a.term.localeCompare(b.term)).slice(0, SIMILAR_TUNING.maxTerms);
}

// ---------------------------------------------------------------------------------------------
// Step 1: PostgreSQL narrows

/** The words that narrow: rarest first, while together they stay within the row budget. */
export function narrowingTerms(terms: readonly Term[]): Term[] {
  const byRarity = [...terms].sort((a, b) => a.uses - b.uses);
  const chosen: Term[] = [];
  let rows = 0;
  for (const term of byRarity) {
    if (chosen.length > 0 && rows + term.uses > SIMILAR_TUNING.textRowBudget) break;
    chosen.push(term);
    rows += term.uses;
  }
  return chosen;
}

export async function findCandidates(request: SimilarRequest, terms: readonly Term[]): Promise<Candidate[]> {
  const narrow = narrowingTerms(terms);
  const stage = request.stage ?? null;
  const symptoms = [...new Set(request.symptoms)];
  const branches: string[] = [];
  if (narrow.length) branches.push(`c.search @@ to_tsquery('english', $narrow)`);
  if (stage && symptoms.length) branches.push(`(c.stage = $stage AND c.symptoms && $symptoms::text[])`);
  else if (stage) branches.push(`c.stage = $stage`);
  else if (symptoms.length >= 2) branches.push(`c.symptoms @> $symptoms::text[]`);
  if (branches.length === 0) return [];
  const idfTotal = terms.reduce((sum, t) => sum + t.idf, 0) || 1;
  const W = SIMILAR_WEIGHTS;
  const T = SIMILAR_TUNING;
  const rows = await getSequelize().query<Candidate & { approx: number }>(
    `WITH terms AS (
       SELECT q, t.idf FROM unnest($terms::text[], $idfs::float8[]) AS t(term, idf), to_tsquery('english', t.term) AS q
        WHERE numnode(q) > 0
     ), hits AS (
       SELECT c.id,
              ${W.text} * coalesce((SELECT sum(terms.idf) FROM terms WHERE c.search @@ terms.q), 0) / $idfTotal
            + ${W.symptoms} * CASE WHEN cardinality($symptoms::text[]) = 0 THEN 0
                                   ELSE o.shared / NULLIF(cardinality(c.symptoms) + cardinality($symptoms::text[]) - o.shared, 0) END
            + ${W.stage} * CASE WHEN c.stage = $stage THEN 1 WHEN c.stage = ANY($family::text[]) THEN ${T.relatedStage} ELSE 0 END
            + ${W.ratio} * CASE WHEN $ratio::float8 IS NULL OR c.sugar_ratio IS NULL THEN 0
                                ELSE GREATEST(0, 1 - abs(c.sugar_ratio - $ratio::float8) / ${T.ratioSpan}) END AS approx
         FROM cases c
         CROSS JOIN LATERAL (SELECT count(*)::float8 AS shared FROM unnest(c.symptoms) s WHERE s = ANY($symptoms::text[])) o
        WHERE c.status IN ('recovered', 'lost') AND c.id <> $exclude AND (NOT $publishedOnly::boolean OR c.published)
          AND (${branches.join(' OR ')})
        ORDER BY approx DESC, c.id DESC
        LIMIT $limit
     )
     SELECT h.approx, c.id, c.title, c.stage, c.symptoms, c.cause, c.remedy, c.outcome, c.status, c.published,
            c.sugar_ratio AS ratio, c.search_text AS text
       FROM hits h JOIN cases c ON c.id = h.id
      ORDER BY h.approx DESC, c.id DESC`,
    {
      // Named, so a parameter a branch does not use is simply not sent.
      bind: {
        terms: terms.map((t) => t.term),
        idfs: terms.map((t) => t.idf),
        narrow: narrow.map((t) => t.term).join(' | '),
        stage,
        symptoms,
        family: stage ? relatedStages(stage) : [],
        ratio: request.ratio,
        exclude: request.excludeId ?? 0,
        publishedOnly: request.publishedOnly,
        idfTotal,
        limit: T.candidateLimit,
      },
      type: QueryTypes.SELECT,
    },
  );
  return rows.map(({ approx: _approx, ...c }) => c);
}

// ---------------------------------------------------------------------------------------------
// Step 2: fuse.js ranks

export const FUSE_OPTIONS = {
  includeScore: true,
  ignoreLocation: true,
  ignoreFieldNorm: true,
  isCaseSensitive: false,
  shouldSort: false,
  minMatchCharLength: 3,
  threshold: SIMILAR_TUNING.fuseThreshold,
} as const;

/** Per term, how well each text holds it: Map<term, Map<index in texts, hit 0–1>>. */
export function termHits(terms: readonly Term[], fuse: Fuse<string>): Map<string, Map<number, number>> {
  const hits = new Map<string, Map<number, number>>();
  for (const term of terms) {
    const found = new Map<number, number>();
    for (const result of fuse.search(term.term)) {
      const hit = Math.max(0, 1 - (result.score ?? 1) / SIMILAR_TUNING.fuseThreshold);
      if (hit > 0) found.set(result.refIndex, hit);
    }
    hits.set(term.term, found);
  }
  return hits;
}

function stageScore(draft: StageId | null | undefined, other: StageId): number {
  if (!draft) return 0;
  if (draft === other) return 1;
  return relatedStages(draft).includes(other) ? SIMILAR_TUNING.relatedStage : 0;
}

const symptomWords = (ids: readonly string[]) => ids.map((id) => labelOf(SYMPTOMS, id).toLowerCase()).join(', ');

/**
 * Scores candidates with the formula at the top of this file, best first, at most `limit`.
 * `fuse` may be handed in already built over exactly `candidates`' texts (the benchmark builds
 * one over all cases once).
 */
export function rankCandidates(
  request: Pick<SimilarRequest, 'stage' | 'symptoms' | 'ratio' | 'limit'>,
  terms: readonly Term[],
  candidates: readonly Candidate[],
  fuse: Fuse<string> = new Fuse(candidates.map((c) => c.text), FUSE_OPTIONS),
): Scored[] {
  const W = SIMILAR_WEIGHTS;
  const hits = termHits(terms, fuse);
  const idfTotal = terms.reduce((sum, t) => sum + t.idf, 0);
  const draftSymptoms = new Set(request.symptoms);
  const scored: Scored[] = [];
  candidates.forEach((candidate, index) => {
    let textPart = 0;
    const mentioned: { word: string; weight: number }[] = [];
    for (const term of terms) {
      const hit = hits.get(term.term)?.get(index) ?? 0;
      if (hit <= 0) continue;
      textPart += term.idf * hit;
      if (hit >= 0.5) mentioned.push({ word: term.term, weight: term.idf * hit });
    }
    const text = idfTotal > 0 ? textPart / idfTotal : 0;
    const shared = candidate.symptoms.filter((s) => draftSymptoms.has(s));
    const union = new Set([...candidate.symptoms, ...draftSymptoms]).size;
    const symptoms = draftSymptoms.size && union ? shared.length / union : 0;
    const stage = stageScore(request.stage, candidate.stage);
    const ratio =
      request.ratio === null || candidate.ratio === null ? 0 : Math.max(0, 1 - Math.abs(candidate.ratio - request.ratio) / SIMILAR_TUNING.ratioSpan);
    const score = W.text * text + W.symptoms * symptoms + W.stage * stage + W.ratio * ratio;
    if (score < SIMILAR_TUNING.minScore) return;

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
      const words = mentioned.sort((a, b) => b.weight - a.weight).slice(0, 4).map((m) => m.word);
      reasons.push({ weight: W.text * text, text: `Mentions ${words.join(', ')}` });
    }
    if (ratio >= 0.5 && candidate.ratio !== null) {
      reasons.push({ weight: W.ratio * ratio, text: `A similar sugar ratio (${candidate.ratio.toFixed(2)} : 1)` });
    }
    scored.push({ candidate, score, reasons: reasons.sort((a, b) => b.weight - a.weight).map((r) => r.text) });
  });
  return scored.sort((a, b) => b.score - a.score || b.candidate.id - a.candidate.id).slice(0, request.limit);
}

export function similarItem(s: Scored): SimilarItem {
  const c = s.candidate;
  return {
    id: c.id,
    title: c.title,
    stage: c.stage,
    symptoms: c.symptoms,
    cause: c.cause,
    remedy: c.remedy,
    outcome: c.outcome,
    status: c.status,
    published: c.published,
    score: Math.round(s.score * 1000) / 1000,
    reasons: s.reasons,
  };
}

export interface SimilarAnswer {
  items: SimilarItem[];
  /** the words that counted, and what a misspelt one was read as */
  terms: { word: string; term: string }[];
}

export async function findSimilarCases(request: SimilarRequest): Promise<SimilarAnswer> {
  const resolved = await resolvedCaseCount();
  const terms = await correctedTerms(request.text, resolved);
  const candidates = await findCandidates(request, terms);
  const ranked = rankCandidates(request, terms, candidates);
  return { items: ranked.map(similarItem), terms: terms.map((t) => ({ word: t.word, term: t.term })) };
}
