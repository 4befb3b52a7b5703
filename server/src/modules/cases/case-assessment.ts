// What the server works out about a case from what the grower told it: the sugar & water
// check, its risk, the sugar ratio, the batch's age when the case was opened, and the urgency.
// The live route (POST /api/cases) and the demo seed both call `assessCase`, so a seeded case
// carries exactly the numbers a real one would.
//
// Urgency is stored in two parts (see cases.repository.ts, `EFFECTIVE_URGENCY_SQL`):
// `cases.urgency` holds everything but the hours waiting (symptoms, risk, batch age at opening:
// none of it changes as time passes), and the waiting part is added when the case is read,
// from `waiting_since`. `effectiveUrgency` below is the same sum in TypeScript.
import { batchCheckInputSchema, checkBatch, type BatchCheckResult, type BatchRisk } from '../../../shared/batch-check';
import type { CaseNumbers } from '../../../shared/case-schemas';
import { URGENCY_WEIGHTS, urgencyScore, type UrgencyLevel, type UrgencyResult } from '../../../shared/urgency';
import { SYMPTOMS, type StageId, type SymptomId } from '../../../shared/vocabulary';

export interface CaseFacts {
  stage: StageId;
  symptoms: readonly SymptomId[];
  numbers?: CaseNumbers | null;
  /** YYYY-MM-DD */
  batchMadeOn?: string | null;
  openedAt: Date;
}

export interface CaseAssessment {
  check: BatchCheckResult | null;
  risk: BatchRisk | null;
  ratio: number | null;
  /** whole days from the batch's making to the case's opening; null when unknown */
  batchAgeDays: number | null;
  /** the stored part of the urgency (no hours waiting) */
  urgency: number;
  urgencyLevel: UrgencyLevel;
}

const DAY_MS = 86_400_000;

export function batchAgeAt(madeOn: string | null | undefined, at: Date): number | null {
  if (!madeOn) return null;
  const made = Date.parse(`${madeOn}T00:00:00Z`);
  if (!Number.isFinite(made)) return null;
  return Math.max(0, Math.floor((at.getTime() - made) / DAY_MS));
}

export function checkOf(stage: StageId, symptoms: readonly SymptomId[], numbers: CaseNumbers | null | undefined): BatchCheckResult | null {
  if (!numbers) return null;
  const parsed = batchCheckInputSchema.safeParse({
    stage,
    culture: numbers.culture,
    sugar: numbers.sugar,
    sugarType: numbers.sugarType,
    moisturePct: numbers.moisturePct,
    symptoms: [...symptoms],
  });
  return parsed.success ? checkBatch(parsed.data) : null;
}

export function assessCase(facts: CaseFacts): CaseAssessment {
  const check = checkOf(facts.stage, facts.symptoms, facts.numbers);
  const batchAgeDays = batchAgeAt(facts.batchMadeOn, facts.openedAt);
  const base = urgencyScore({ symptoms: facts.symptoms, risk: check?.risk ?? null, batchAgeDays, hoursWaiting: 0, stage: facts.stage });
  return {
    check,
    risk: check?.risk ?? null,
    ratio: check ? check.ratio : null,
    batchAgeDays,
    urgency: base.score,
    urgencyLevel: base.level,
  };
}

export function hoursSince(since: Date | string | null | undefined, now: Date = new Date()): number | null {
  if (!since) return null;
  const at = since instanceof Date ? since.getTime() : Date.parse(since);
  return Math.max(0, (now.getTime() - at) / 3_600_000);
}

/** The urgency as the rounds list shows it now (same sum as EFFECTIVE_URGENCY_SQL). */
export function effectiveUrgency(args: {
  stage: StageId;
  symptoms: readonly SymptomId[];
  risk: BatchRisk | null;
  batchAgeDays: number | null;
  waitingHours: number | null;
}): UrgencyResult {
  return urgencyScore({
    stage: args.stage,
    symptoms: args.symptoms,
    risk: args.risk,
    batchAgeDays: args.batchAgeDays,
    hoursWaiting: args.waitingHours ?? 0,
  });
}

/** "IMO2: putrid or rotten smell" — from the stage and the symptom that weighs most. */
export function defaultTitle(stage: StageId, symptoms: readonly SymptomId[]): string {
  const main = [...symptoms].sort((a, b) => URGENCY_WEIGHTS.symptoms[b] - URGENCY_WEIGHTS.symptoms[a])[0];
  if (!main) return stage === 'other' ? 'A batch needs a second look' : `${stage} batch needs a second look`;
  const item = SYMPTOMS.find((s) => s.id === main)!;
  const label = item.label.toLowerCase();
  const words = item.group === 'smell' ? `${label} smell` : item.group === 'colour' ? `${label} growth` : label;
  const more = symptoms.length > 1 ? ` and ${symptoms.length - 1} more` : '';
  return `${stage === 'other' ? 'Batch' : stage}: ${words}${more}`;
}
