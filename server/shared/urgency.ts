// How urgently a case needs a mentor, for the rounds table (PRODUCT.md, "The computation the job
// needs", 2). The score is a plain sum of points so that the rounds page can show where every
// point came from.
//
// | part                         | points                                                     |
// |------------------------------|------------------------------------------------------------|
// | putrid or rotten smell       | 25                                                         |
// | bubbling or foaming          | 20 (5 while an FPJ, FFJ or LAB is in its first 10 days,    |
// |                              |    when fermenting is what it is meant to do)               |
// | free liquid pooling          | 20                                                         |
// | slimy                        | 20                                                         |
// | black, or pink/red growth    | 12 each                                                    |
// | wet and sloppy; ammonia      | 10 each                                                    |
// | bright green; insects        | 8 each                                                     |
// | blue-green                   | 6                                                          |
// | sour, alcoholic, musty;      | 5 each                                                     |
// | animal damage                |                                                            |
// | dark grey                    | 4                                                          |
// | yellow/orange; fuzzy growth  | 3 each                                                     |
// | clumped; dry or crusty       | 2 each                                                     |
// | sweet, earthy, no smell,     | 0 (the signs of a healthy batch)                           |
// | white, light grey, brown     |                                                            |
// | symptoms together            | at most 55                                                 |
// | the sugar check's risk       | high 15, medium 7, low 0                                   |
// | batch age                    | 0–3 days 10, 4–14 days 5, older or unknown 0               |
// | hours waiting for a reply    | 1 an hour, at most 20                                      |
//
// Total 0–100, rounded to a whole number. Level: high from 45, medium from 20, else low.
//
// Why a young batch weighs more: a batch in its first days changes by the hour, and the usual
// fixes (more sugar, draining, a cooler spot) work only if they come early; an old kept culture
// that turns has usually turned slowly and will still be there tomorrow. Waiting climbs steadily
// so that no case sits unseen, and stops at 20 so that a long-forgotten dry crust does not
// outrank a fresh putrid one.
import type { StageId, SymptomId } from './vocabulary';
import { SYMPTOMS } from './vocabulary';

export type UrgencyLevel = 'low' | 'medium' | 'high';
export const URGENCY_LEVELS = ['low', 'medium', 'high'] as const satisfies readonly UrgencyLevel[];

export const URGENCY_WEIGHTS = {
  symptoms: {
    'smell-putrid': 25,
    bubbling: 20,
    'free-liquid': 20,
    slimy: 20,
    'colour-black': 12,
    'colour-pink-red': 12,
    'wet-sloppy': 10,
    'smell-ammonia': 10,
    'colour-bright-green': 8,
    insects: 8,
    'colour-blue-green': 6,
    'smell-sour': 5,
    'smell-alcoholic': 5,
    'smell-musty': 5,
    'animal-damage': 5,
    'colour-dark-grey': 4,
    'colour-yellow-orange': 3,
    'fuzzy-growth': 3,
    clumped: 2,
    'dry-crusty': 2,
    'smell-sweet': 0,
    'smell-earthy': 0,
    'smell-none': 0,
    'colour-white': 0,
    'colour-light-grey': 0,
    'colour-brown': 0,
  } satisfies Record<SymptomId, number>,
  symptomCap: 55,
  /** bubbling is what a young juice or serum ferment is meant to do */
  fermentingBubbling: { stages: ['FPJ', 'FFJ', 'LAB'] as readonly StageId[], maxAgeDays: 10, points: 5 },
  risk: { low: 0, medium: 7, high: 15 },
  /** the first band whose maxDays covers the age gives its points */
  age: [
    { maxDays: 3, points: 10 },
    { maxDays: 14, points: 5 },
  ],
  waitingPointsPerHour: 1,
  waitingCap: 20,
  levels: { high: 45, medium: 20 },
} as const;

export interface UrgencyInput {
  symptoms: readonly SymptomId[];
  /** the sugar & water check's risk, when the case has numbers */
  risk?: 'low' | 'medium' | 'high' | null;
  batchAgeDays?: number | null;
  hoursWaiting: number;
  stage?: StageId | null;
}

export interface UrgencyResult {
  score: number;
  level: UrgencyLevel;
  /** one line per part that added points, largest first, e.g. "Putrid or rotten smell (+25)" */
  reasons: string[];
}

export function urgencyLevelOf(score: number): UrgencyLevel {
  if (score >= URGENCY_WEIGHTS.levels.high) return 'high';
  if (score >= URGENCY_WEIGHTS.levels.medium) return 'medium';
  return 'low';
}

function finiteOrNull(value: number | null | undefined): number | null {
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

export function urgencyScore(input: UrgencyInput): UrgencyResult {
  const w = URGENCY_WEIGHTS;
  const age = finiteOrNull(input.batchAgeDays);
  const fermenting =
    input.stage != null &&
    w.fermentingBubbling.stages.includes(input.stage) &&
    age !== null &&
    age >= 0 &&
    age <= w.fermentingBubbling.maxAgeDays;

  const symptomParts: Part[] = [];
  for (const symptom of new Set(input.symptoms)) {
    const label = symptomWords(symptom);
    if (symptom === 'bubbling' && fermenting) {
      symptomParts.push({ points: w.fermentingBubbling.points, reason: `${label}, expected while a young ${input.stage} ferments` });
    } else {
      symptomParts.push({ points: w.symptoms[symptom] ?? 0, reason: label });
    }
  }
  const symptomSum = symptomParts.reduce((sum, p) => sum + p.points, 0);

  const otherParts: Part[] = [];
  if (input.risk) {
    otherParts.push({ points: w.risk[input.risk], reason: `The sugar & water check says ${input.risk} risk` });
  }
  if (age !== null && age >= 0) {
    const band = w.age.find((b) => age <= b.maxDays);
    const days = Math.round(age);
    if (band) otherParts.push({ points: band.points, reason: `The batch is only ${days} ${days === 1 ? 'day' : 'days'} old` });
  }
  const hours = Math.max(0, finiteOrNull(input.hoursWaiting) ?? 0);
  const whole = Math.floor(hours);
  otherParts.push({
    points: Math.min(w.waitingCap, hours * w.waitingPointsPerHour),
    reason: `Waiting for a reply for ${whole < 1 ? 'under an hour' : `${whole} ${whole === 1 ? 'hour' : 'hours'}`}`,
  });

  const total = Math.min(w.symptomCap, symptomSum) + otherParts.reduce((sum, p) => sum + p.points, 0);
  const score = Math.max(0, Math.min(100, Math.round(total)));
  const reasons = [...symptomParts, ...otherParts]
    .filter((p) => Math.round(p.points) > 0)
    .sort((a, b) => b.points - a.points)
    .map((p) => `${p.reason} (+${Math.round(p.points)})`);
  if (symptomSum > w.symptomCap) reasons.push(`Symptoms count at most ${w.symptomCap} points together`);
  return { score, level: urgencyLevelOf(score), reasons };
}

/** "Putrid or rotten smell", "Pink or red growth", "Slimy": a reason a mentor can read alone. */
function symptomWords(symptom: SymptomId): string {
  const item = SYMPTOMS.find((s) => s.id === symptom);
  if (!item) return symptom;
  if (item.group === 'smell') return `${item.label} smell`;
  if (item.group === 'colour') return `${item.label} growth`;
  return item.label;
}

interface Part {
  points: number;
  reason: string;
}

/** A high-urgency case nobody has taken for this long is mailed to the mentors who asked for it (once a case). */
export const URGENT_WAIT_MINUTES = 60;

/** A mentor's reply mails the grower (when they are away) at most once a case in this many minutes. */
export const REPLY_MAIL_WINDOW_MINUTES = 10;

/** A grower's post on a case a mentor holds, left unread this long, is mailed to that mentor (once, until they read). */
export const GROWER_WROTE_MAIL_MINUTES = 10;
