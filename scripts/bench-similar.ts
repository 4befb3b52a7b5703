// `npm run bench:similar`: "batches like this" at 100,000 resolved cases (QUALITY.md budget:
// p95 ≤ 25 ms, and the top 5 agree with a full fuse.js ranking on ≥ 80 % of a fixed query set).
//
// A throw-away PostgreSQL cluster in a temporary folder, migrated from empty; 100,000 synthetic
// resolved cases (seeded, so every run has the same data) built from a word list with the
// trade's words; search_terms filled the way the demo seed fills it; then a fixed set of 50
// drafts (a third of them misspelt) runs through the real service, `findSimilarCases`.
//
// What is printed:
// - latency: p50 / p95 / max of findSimilarCases over 3 timed rounds of the 50 drafts (after
//   one warm-up round), wall clock in this process, plus where the time goes;
// - agreement: for each draft, the same score formula computed with fuse.js over all 100,000
//   cases (no narrowing) gives the "full" top 5. Agreement = |our top 5 ∩ full top 5| / 5,
//   averaged over the drafts. Because many cases can tie on score, a tie-aware figure is
//   printed as well: an item of ours counts when its full score is at least the full 5th
//   score. And the hit rate: how often the case a draft was written from is in our top 5.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import Fuse from 'fuse.js';
import { QueryTypes } from 'sequelize';
import { CAUSE_IDS, REMEDY_IDS, STAGE_IDS, SYMPTOM_IDS, type StageId, type SymptomId } from '../server/shared/vocabulary';
import { migrate } from '../server/src/db/migrator';
import { initModels } from '../server/src/db/models';
import { closeSequelize, getSequelize, initSequelize } from '../server/src/db/sequelize';
import { ensureDatabase, startCluster, stopCluster } from '../server/src/lib/local-postgres';
import { buildSearchText, indexResolvedCases, queryWords } from '../server/src/modules/cases/search-index';
import {
  FUSE_WORD_OPTIONS,
  creditsFor,
  findCandidates,
  findSimilarCases,
  flattenAlternatives,
  forgetResolvedCount,
  keepUnits,
  rankCandidates,
  readUnits,
  resolvedCaseCount,
  unitOf,
  type Candidate,
  type SimilarRequest,
} from '../server/src/modules/cases/similar.service';

const CASES = Number(process.env.BENCH_CASES ?? 100_000);
const DRAFTS = 50;
const ROUNDS = 3;
const say = (line: string) => console.log(`[bench:similar] ${line}`);

// ---------------------------------------------------------------------------------------------
// Seeded data

function prng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
const random = prng(20_261_201);
const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)];

// Everyday words first (drawn often), then the trade's words (drawn less and less often down the list).
const COMMON = `batch jar week day days morning night smell smells looks look top bottom side layer lid cover cloth paper
shelf shed kitchen warm cool cold wet dry little lot bit half whole first second third started stopped still again
never always usually maybe seems seemed think checked opened stirred mixed added poured left kept moved changed`.split(/\s+/);
const TRADE = `rice culture sugar brown molasses bran mould mold white threads fuzzy hyphae spores foam foaming bubbles
bubbling fizz fizzing vinegar sour sweet alcohol yeasty wine beer putrid rotten ammonia musty earthy mushroom forest
leaf litter humus cedar box crock clay glass ferment fermenting fermented juice plant fruit mugwort comfrey nettle
dandelion bamboo shoots tips banana papaya mango plum apple citrus peel whey milk serum curd eggshell shell bone
calcium phosphate vinegar roasted herbs garlic ginger cinnamon liquorice angelica tincture straining strained
drain drained liquid pooling sloppy slimy slime crusty crust clumped clumps lumps larvae flies gnats ants mice rats
digging tipped mesh stone shade sun rain soaked soggy heat hot temperature thermometer pile turned turning
mixed soil field beds compost diluted dilution watering spray sprayed seedlings leaves roots yellow orange pink red
green blue grey black dark light patch patches spots speckles film skin crust surface sediment cloudy clear
separated layers greenish bluish blackish smelly pungent sharp tangy acidic bitter`.split(/\s+/);
// …and a long tail of invented words (names of places, plants and brews in the demo's manner),
// so that, as in real writing, most words are rare and a few are everywhere.
const SYLLABLES = 'ka lo mi ren tor vel sha bri dun fel gor hal jin mar nor pel quin ras sil tam ul vor wen yar zel'.split(' ');
const TAIL = (() => {
  const made = new Set<string>();
  while (made.size < 8000) {
    const n = random() < 0.5 ? 2 : 3;
    made.add(Array.from({ length: n }, () => pick(SYLLABLES)).join(''));
  }
  return [...made].filter((w) => !COMMON.includes(w) && !TRADE.includes(w));
})();
const WORDS = [...COMMON, ...TRADE, ...TAIL];

/** Zipf-like: word i drawn with weight 1 / (i + 8)^1.1. */
const CUMULATIVE = (() => {
  let sum = 0;
  return WORDS.map((_, i) => (sum += 1 / Math.pow(i + 8, 1.1)));
})();
function word(): string {
  const x = random() * CUMULATIVE[CUMULATIVE.length - 1];
  let lo = 0;
  let hi = CUMULATIVE.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (CUMULATIVE[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return WORDS[lo];
}
const words = (min: number, max: number) => Array.from({ length: min + Math.floor(random() * (max - min + 1)) }, word).join(' ');

const TYPICAL: Partial<Record<StageId, SymptomId[]>> = {
  IMO1: ['colour-white', 'fuzzy-growth', 'colour-bright-green', 'dry-crusty', 'animal-damage', 'smell-earthy'],
  IMO2: ['bubbling', 'smell-alcoholic', 'free-liquid', 'smell-sour', 'wet-sloppy', 'colour-white'],
  IMO3: ['smell-ammonia', 'dry-crusty', 'colour-white', 'clumped', 'insects', 'smell-earthy'],
  IMO4: ['smell-ammonia', 'wet-sloppy', 'insects', 'smell-musty', 'clumped'],
  FPJ: ['bubbling', 'smell-sweet', 'smell-alcoholic', 'colour-white', 'fuzzy-growth', 'smell-sour'],
  FFJ: ['bubbling', 'smell-alcoholic', 'colour-blue-green', 'fuzzy-growth', 'insects'],
  LAB: ['smell-sour', 'colour-yellow-orange', 'smell-putrid', 'slimy', 'colour-pink-red'],
};

function symptomsFor(stage: StageId): SymptomId[] {
  const set = new Set<SymptomId>();
  const n = 1 + Math.floor(random() * 4);
  while (set.size < n) set.add(random() < 0.65 && TYPICAL[stage] ? pick(TYPICAL[stage]!) : pick(SYMPTOM_IDS));
  return [...set];
}

interface Synthetic {
  stage: StageId;
  symptoms: SymptomId[];
  title: string;
  description: string;
  ratio: number | null;
  cause: string;
  remedy: string;
  searchText: string;
}

function synthetic(): Synthetic {
  const stage = random() < 0.8 ? pick(['IMO1', 'IMO2', 'IMO3', 'IMO4', 'FPJ', 'FFJ', 'LAB'] as const) : pick(STAGE_IDS);
  const symptoms = symptomsFor(stage);
  const title = `${stage} ${words(3, 6)}`;
  const description = words(18, 45);
  const cause = pick(CAUSE_IDS);
  const remedy = pick(REMEDY_IDS);
  const causeNotes = words(4, 10);
  const remedyNotes = words(4, 12);
  const summary = words(8, 16);
  const ratio = random() < 0.6 ? Math.round(random() * 150) / 100 : null;
  return {
    stage,
    symptoms,
    title,
    description,
    ratio,
    cause,
    remedy,
    searchText: buildSearchText({ title, description, stage, symptoms, cause, causeNotes, remedy, remedyNotes, summary }),
  };
}

function misspell(text: string): string {
  return text
    .split(' ')
    .map((w, i) => {
      if (w.length < 5 || (i + w.length) % 3 !== 0) return w;
      const at = 1 + Math.floor(random() * (w.length - 2));
      const kind = random();
      if (kind < 0.4) return w.slice(0, at) + w.slice(at + 1); // a letter dropped
      if (kind < 0.7) return w.slice(0, at) + w[at + 1] + w[at] + w.slice(at + 2); // two swapped
      return w.slice(0, at) + w[at] + w.slice(at); // a letter doubled
    })
    .join(' ');
}

// ---------------------------------------------------------------------------------------------

async function seed(): Promise<Synthetic[]> {
  // Generated in full first, so a kept database gets the very same drafts next time.
  const all = Array.from({ length: CASES }, () => ({ ...synthetic(), age: 8 + Math.floor(random() * 700) }));
  const sequelize = getSequelize();
  const [present] = await sequelize.query<{ n: number }>(`SELECT count(*)::int AS n FROM cases`, { type: QueryTypes.SELECT });
  if (present.n === CASES) {
    say(`reusing the ${CASES.toLocaleString('en')} cases already in the kept database`);
    return all;
  }
  const [user] = await sequelize.query<{ id: number }>(
    `INSERT INTO users (email, display_name, password_hash, role) VALUES ('bench@example.test', 'Bench grower', 'x', 'grower') RETURNING id`,
    { type: QueryTypes.SELECT },
  );
  const started = performance.now();
  const BATCH = 5000;
  for (let from = 0; from < CASES; from += BATCH) {
    const rows = all.slice(from, from + BATCH);
    await sequelize.query(
      `INSERT INTO cases (grower_id, stage, symptoms, title, description, status, outcome, cause, remedy, sugar_ratio, search_text,
                          published, consent_to_publish, opened_at, resolved_at, waiting_since)
       SELECT $grower, r.stage, r.symptoms::text[], r.title, r.description, r.status, r.status, r.cause, r.remedy, r.ratio, r.text,
              true, true, now() - make_interval(days => r.age), now() - make_interval(days => r.age - 7), NULL
         FROM unnest($stage::text[], $symptoms::text[], $title::text[], $description::text[], $status::text[], $cause::text[],
                     $remedy::text[], $ratio::float8[], $text::text[], $age::int[])
           AS r(stage, symptoms, title, description, status, cause, remedy, ratio, text, age)`,
      {
        bind: {
          grower: user.id,
          stage: rows.map((r) => r.stage),
          symptoms: rows.map((r) => `{${r.symptoms.join(',')}}`),
          title: rows.map((r) => r.title),
          description: rows.map((r) => r.description),
          status: rows.map((_, i) => ((from + i) % 5 === 0 ? 'lost' : 'recovered')),
          cause: rows.map((r) => r.cause),
          remedy: rows.map((r) => r.remedy),
          ratio: rows.map((r) => r.ratio),
          text: rows.map((r) => r.searchText),
          age: rows.map((r) => r.age),
        },
      },
    );
  }
  say(`inserted ${CASES.toLocaleString('en')} resolved cases in ${((performance.now() - started) / 1000).toFixed(1)} s`);
  const indexing = performance.now();
  await indexResolvedCases('all');
  // VACUUM too: the structural end is an index-only scan, which needs the visibility map.
  await sequelize.query('VACUUM ANALYZE cases');
  await sequelize.query('VACUUM ANALYZE search_terms');
  const [terms] = await sequelize.query<{ n: number }>(`SELECT count(*)::int AS n FROM search_terms`, { type: QueryTypes.SELECT });
  say(`search_terms: ${terms.n} words counted in ${((performance.now() - indexing) / 1000).toFixed(1)} s`);
  return all;
}

interface Draft {
  request: SimilarRequest;
  /** id of the case the draft was written from */
  from: number;
  misspelt: boolean;
}

function drafts(all: Synthetic[], firstId: number): Draft[] {
  const list: Draft[] = [];
  for (let i = 0; i < DRAFTS; i++) {
    const index = Math.floor(random() * all.length);
    const source = all[index];
    const sourceWords = `${source.title} ${source.description}`.split(' ').slice(1);
    const chosen = Array.from({ length: 5 + Math.floor(random() * 6) }, () => pick(sourceWords));
    const extra = words(1, 3);
    let text = `${chosen.join(' ')} ${extra}`;
    const misspelt = i % 3 === 0;
    if (misspelt) text = misspell(text);
    // Most drafts name the stage and some symptoms; some are text only, some have no text.
    const kind = i % 10;
    list.push({
      from: firstId + index,
      misspelt,
      request: {
        stage: kind === 7 ? null : source.stage,
        symptoms: kind === 7 ? [] : source.symptoms.slice(0, Math.max(1, source.symptoms.length - (i % 2))),
        text: kind === 8 ? '' : text,
        ratio: source.ratio,
        limit: 5,
        publishedOnly: false,
      },
    });
  }
  return list;
}

/** How a draft's words were read: each word's alternatives (a misspelt word's shortlist). */
const readingOf = (units: { term: string; alternatives: { term: string }[] }[]) =>
  units.map((u) => `${u.term}:${u.alternatives.map((a) => a.term).join('/')}`).sort().join(' ');

/** The generated cases are let go once the drafts are written, so their garbage does not land in the timings. */
async function seedAndWriteDrafts(): Promise<Draft[]> {
  const all = await seed();
  const [{ first }] = await getSequelize().query<{ first: number }>(`SELECT min(id)::int AS first FROM cases`, { type: QueryTypes.SELECT });
  return drafts(all, first);
}

const quantile = (sorted: number[], q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];

/** CPU milliseconds used so far by the cluster's server processes (Linux /proc; 0 elsewhere). */
function clusterCpuMs(dataDir: string): number {
  try {
    const postmaster = Number(fs.readFileSync(path.join(dataDir, 'postmaster.pid'), 'utf8').split('\n')[0]);
    const tick = 100; // USER_HZ on Linux
    let total = 0;
    for (const entry of fs.readdirSync('/proc')) {
      if (!/^\d+$/.test(entry)) continue;
      try {
        const stat = fs.readFileSync(`/proc/${entry}/stat`, 'utf8');
        const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
        const ppid = Number(fields[1]);
        if (ppid !== postmaster && Number(entry) !== postmaster) continue;
        total += ((Number(fields[11]) + Number(fields[12])) * 1000) / tick;
      } catch {
        // the process ended meanwhile
      }
    }
    return total;
  } catch {
    return 0;
  }
}

async function main(): Promise<number> {
  // BENCH_KEEP=<folder> keeps the cluster's data there (and reuses it next time) for a closer look.
  const keep = process.env.BENCH_KEEP ? path.resolve(process.env.BENCH_KEEP) : null;
  const tmp = keep ?? fs.mkdtempSync(path.join(os.tmpdir(), 'sporewell-bench-'));
  fs.mkdirSync(tmp, { recursive: true });
  fs.chmodSync(tmp, 0o755);
  let dataDir: string | null = null;
  const cleanup = () => {
    if (dataDir) stopCluster(dataDir, 'immediate');
    dataDir = null;
    if (!keep) fs.rmSync(tmp, { recursive: true, force: true });
  };
  process.on('SIGINT', () => {
    cleanup();
    process.exit(130);
  });
  try {
    const cluster = await startCluster({ dataDir: path.join(tmp, 'pg'), metaFile: path.join(tmp, 'pg.json'), say });
    dataDir = cluster.dataDir;
    await ensureDatabase(cluster, 'sporewell_bench');
    const sequelize = initSequelize(cluster.url('sporewell_bench'));
    initModels(sequelize);
    await migrate(sequelize);

    const set = await seedAndWriteDrafts();
    forgetResolvedCount();

    // Latency, through the real service; CPU time of this process and of the cluster's backends
    // alongside, since wall time on a shared machine also counts other people's work.
    for (const d of set) await findSimilarCases(d.request);
    const times: number[] = [];
    const ours = new Map<Draft, number[]>();
    const cpuBefore = { node: process.cpuUsage(), pg: clusterCpuMs(cluster.dataDir) };
    for (let round = 0; round < ROUNDS; round++) {
      for (const d of set) {
        const started = performance.now();
        const answer = await findSimilarCases(d.request);
        times.push(performance.now() - started);
        ours.set(d, answer.items.map((i) => i.id));
      }
    }
    const nodeCpu = process.cpuUsage(cpuBefore.node);
    const nodeCpuPerDraft = (nodeCpu.user + nodeCpu.system) / 1000 / times.length;
    const pgCpuPerDraft = (clusterCpuMs(cluster.dataDir) - cpuBefore.pg) / times.length;
    const cpuPerDraft = nodeCpuPerDraft + pgCpuPerDraft;
    times.sort((a, b) => a - b);

    // Where the time goes (one more pass, step by step).
    const candidateIds = new Map<Draft, Set<number>>();
    const readAs = new Map<Draft, string>();
    const steps = { words: [] as number[], sql: [] as number[], rank: [] as number[], candidates: [] as number[], wordsPg: 0, sqlPg: 0 };
    const resolved = await resolvedCaseCount();
    for (const d of set) {
      let at = performance.now();
      let pgAt = clusterCpuMs(cluster.dataDir);
      const units = await readUnits(d.request.text, resolved);
      steps.words.push(performance.now() - at);
      steps.wordsPg += clusterCpuMs(cluster.dataDir) - pgAt;
      at = performance.now();
      pgAt = clusterCpuMs(cluster.dataDir);
      const candidates = await findCandidates(d.request, units);
      steps.sql.push(performance.now() - at);
      candidateIds.set(d, new Set(candidates.map((c) => c.id)));
      readAs.set(d, readingOf(units));
      steps.sqlPg += clusterCpuMs(cluster.dataDir) - pgAt;
      steps.candidates.push(candidates.length);
      at = performance.now();
      rankCandidates(d.request, units, candidates);
      steps.rank.push(performance.now() - at);
    }
    const median = (xs: number[]) => quantile([...xs].sort((a, b) => a - b), 0.5);
    const p95 = (xs: number[]) => quantile([...xs].sort((a, b) => a - b), 0.95);

    // The full ranking: the same formula over every case, with no narrowing and no trigram
    // shortlist — a misspelt word is matched by fuse.js against the whole vocabulary.
    // BENCH_SKIP_FULL=1 skips it while tuning (the budget then cannot be judged).
    const skipFull = process.env.BENCH_SKIP_FULL === '1';
    let strict = 0;
    let tieAware = 0;
    let hits = 0;
    const missed = { notNarrowed: 0, scoredApart: 0, wordsReadApart: 0 };
    if (!skipFull) {
      say('ranking every draft over all cases (this is the slow part)…');
      const fullStarted = performance.now();
      const vocabulary = await getSequelize().query<{ term: string; uses: number }>(`SELECT term, uses FROM search_terms ORDER BY term`, {
        type: QueryTypes.SELECT,
      });
      const known = new Map(vocabulary.map((v) => [v.term, v]));
      const vocabularyFuse = new Fuse(vocabulary.map((v) => v.term), FUSE_WORD_OPTIONS);
      const everything = await getSequelize().query<Omit<Candidate, 'matched'>>(
        `SELECT id, stage, symptoms, sugar_ratio AS ratio FROM cases WHERE status IN ('recovered', 'lost') ORDER BY id`,
        { type: QueryTypes.SELECT },
      );
      for (const d of set) {
        const units = keepUnits(
          queryWords(d.request.text)
            .slice(0, 40)
            .map((word) =>
              known.has(word)
                ? unitOf(word, [{ term: word, uses: known.get(word)!.uses, credit: 1 }], resolved)
                : unitOf(word, creditsFor(word, vocabulary, vocabularyFuse), resolved),
            ),
        );
        const alternatives = flattenAlternatives(units);
        const matched = new Map<number, number[]>();
        if (alternatives.length) {
          // Every case holding any alternative (the index finds exactly those; the rest hold none).
          const rows = await getSequelize().query<{ id: number; matched: number[] }>(
            `WITH alts AS MATERIALIZED (
               SELECT a.k, to_tsquery('english', a.term) AS q FROM unnest($terms::text[]) WITH ORDINALITY AS a(term, k)
             )
             SELECT c.id, ARRAY(SELECT a.k - 1 FROM alts a WHERE d.v @@ a.q ORDER BY a.k) AS matched
               FROM cases c CROSS JOIN LATERAL (SELECT c.search || ''::tsvector AS v OFFSET 0) d
              WHERE c.status IN ('recovered', 'lost') AND c.search @@ to_tsquery('english', $any)`,
            { bind: { terms: alternatives.map((a) => a.term), any: alternatives.map((a) => a.term).join(' | ') }, type: QueryTypes.SELECT },
          );
          for (const row of rows) matched.set(row.id, row.matched);
        }
        const full = rankCandidates({ ...d.request, limit: 1000 }, units, everything.map((c) => ({ ...c, matched: matched.get(c.id) ?? [] })));
        const fullTop = full.slice(0, 5).map((x) => x.candidate.id);
        const fifth = full[Math.min(4, full.length - 1)]?.score ?? 0;
        const fullScore = new Map(full.map((x) => [x.candidate.id, x.score]));
        const mine = ours.get(d)!;
        const denominator = Math.max(mine.length, fullTop.length);
        if (denominator === 0) {
          strict += 1;
          tieAware += 1;
        } else {
          strict += mine.filter((id) => fullTop.includes(id)).length / denominator;
          tieAware += mine.filter((id) => fullTop.includes(id) || (fullScore.get(id) ?? -1) >= fifth - 1e-9).length / denominator;
        }
        if (mine.includes(d.from)) hits += 1;
        // Why a full top-5 case is not in ours: PostgreSQL left it out, or it was a candidate and
        // scored lower here (then usually because a misspelt word was read differently).
        const sameReading = readAs.get(d) === readingOf(units);
        for (const id of fullTop.filter((id) => !mine.includes(id) && (fullScore.get(id) ?? 0) > (fullScore.get(mine[mine.length - 1]) ?? 0) + 1e-9)) {
          if (!candidateIds.get(d)!.has(id)) {
            missed.notNarrowed += 1;
            if (process.env.BENCH_DEBUG) {
              const x = full.find((f) => f.candidate.id === id)!;
              console.log('missed', JSON.stringify({ draft: d.request.stage, sym: d.request.symptoms, words: units.map((u) => `${u.term}:${u.alternatives[0].uses}`).join(' '), id, stage: x.candidate.stage, sym2: x.candidate.symptoms, score: x.score.toFixed(3), reasons: x.reasons, ours: (fullScore.get(mine[mine.length - 1]) ?? 0).toFixed(3) }));
            }
          }
          else if (sameReading) missed.scoredApart += 1;
          else missed.wordsReadApart += 1;
        }
      }
      say(`full ranking: ${((performance.now() - fullStarted) / 1000 / set.length).toFixed(1)} s per draft`);
    }

    const pct = (x: number) => `${((100 * x) / set.length).toFixed(1)} %`;
    const ms = (x: number) => `${x.toFixed(1)} ms`;
    const load = os.loadavg()[0];
    console.log('');
    console.log(`batches like this at ${CASES.toLocaleString('en')} resolved cases, ${set.length} drafts (${set.filter((d) => d.misspelt).length} misspelt), ${ROUNDS} timed rounds`);
    console.log(`  machine   ${os.cpus().length} cores, load average ${load.toFixed(1)} during the run`);
    console.log(`  latency   p50 ${ms(quantile(times, 0.5))}   p95 ${ms(quantile(times, 0.95))}   max ${ms(times[times.length - 1])}   (budget p95 ≤ 25 ms)`);
    console.log(`  CPU       ${ms(cpuPerDraft)} per draft (${ms(nodeCpuPerDraft)} in this process + ${ms(pgCpuPerDraft)} in PostgreSQL): about the time it takes on an idle core`);
    console.log(`  steps     words ${ms(median(steps.words))} / ${ms(p95(steps.words))}   narrowing SQL ${ms(median(steps.sql))} / ${ms(p95(steps.sql))}   ranking ${ms(median(steps.rank))} / ${ms(p95(steps.rank))}   (median / p95)`);
    console.log(`  PostgreSQL CPU per draft: words ${ms(steps.wordsPg / set.length)}, narrowing ${ms(steps.sqlPg / set.length)}`);
    console.log(`  candidates per draft: median ${median(steps.candidates)}, max ${Math.max(...steps.candidates)}`);
    if (!skipFull) {
      console.log(`  agreement of the top 5 with the full ranking: ${pct(strict)} exact, ${pct(tieAware)} counting ties   (budget ≥ 80 %)`);
      console.log(`  hit rate: the draft's source case in the top 5 for ${pct(hits)} of drafts`);
      console.log(`  full top-5 cases missing from ours (not counting ties): ${missed.notNarrowed} left out by the narrowing, ${missed.wordsReadApart} scored lower because a misspelt word was read differently, ${missed.scoredApart} otherwise`);
    }
    const ok = !skipFull && quantile(times, 0.95) <= 25 && strict / set.length >= 0.8;
    console.log(ok ? '  within budget' : skipFull ? '  (agreement skipped)' : '  OVER BUDGET');
    return ok ? 0 : 1;
  } finally {
    await closeSequelize();
    cleanup();
  }
}

main().then(
  (code) => process.exit(code),
  (error) => {
    console.error(`[bench:similar] ${(error as Error).stack ?? error}`);
    process.exit(1);
  },
);
