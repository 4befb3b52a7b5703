// The sugar & water check (PRODUCT.md, "The computation the job needs", 1): how much sugar a
// batch has against its stage's usual rule, what the scale should read, and an estimate of the
// mix's water activity with the microbe groups that can still grow at it.
//
// Model, in short: water = culture × its moisture + sugar × the sugar's water; sucrose = sugar ×
// its sucrose share; only as much sucrose dissolves as the water can hold at 20 °C; the Norrish
// equation turns dissolved sucrose and water into water activity. Other solutes (the culture's
// own sugars and salts, the glucose and fructose in brown sugar) are left out, and they would
// lower water activity a little further, so the estimate leans to the wet, cautious side.
//
// This file is the model's data and computations without zod, so a page that only shows a check
// (the case page) does not load the schema library; batch-check.ts adds the input's schema and
// `checkBatch`, and re-exports everything here.
import type { StageId, SymptomId } from './vocabulary';
import type { BatchCheckParsed } from './batch-check';
import { formatMass, fromGrams, toGrams, type MassUnit } from './units';
import { DISCARD_SIGN_WORDS, SAFETY_CAUTIONS, discardNote, discardSignsIn, type DiscardSign } from './cautions';

// ---------------------------------------------------------------------------------------------
// Physical constants

/** g/mol, from the standard atomic weights (C12H22O11). */
export const SUCROSE_MOLAR_MASS = 342.2965;
/** g/mol (H2O). */
export const WATER_MOLAR_MASS = 18.015;
/** Norrish constant for sucrose: Norrish, J. Food Technol. 1:25 (1966); Chirife, Ferro Fontán &
 * Benmergui, J. Food Technol. 15:59 (1980). */
export const NORRISH_K_SUCROSE = 6.47;
/** g sucrose per 100 g water at 20 °C: Mohos, Confectionery and Chocolate Engineering (2010),
 * Table A2.2 (211.4 g at 25 °C). We take 20 °C because batches sit in cool shade; warmer
 * batches dissolve a little more, which only matters past saturation. */
export const SUCROSE_SOLUBILITY_PER_100G_WATER = 203.9;

// ---------------------------------------------------------------------------------------------
// Sugars

export const SUGAR_TYPE_IDS = ['brown', 'white', 'raw'] as const;
export type SugarTypeId = (typeof SUGAR_TYPE_IDS)[number];

export interface SugarType {
  id: SugarTypeId;
  label: string;
  /** g water per 100 g sugar */
  waterPct: number;
  /** g sucrose per 100 g sugar */
  sucrosePct: number;
  source: string;
}

export const SUGAR_TYPES: Readonly<Record<SugarTypeId, SugarType>> = {
  brown: {
    id: 'brown',
    label: 'brown sugar',
    waterPct: 1.34,
    sucrosePct: 94.56,
    source: 'USDA SR28 / SR Legacy, NDB 19334 "Sugars, brown": water 1.34 g/100 g; sucrose 94.56 g/100 g (from memory)',
  },
  white: {
    id: 'white',
    label: 'white sugar',
    waterPct: 0.02,
    sucrosePct: 99.8,
    source: 'USDA SR28 / SR Legacy, NDB 19335 "Sugars, granulated": water 0.02 g/100 g; sucrose 99.80 g/100 g (from memory)',
  },
  raw: {
    id: 'raw',
    label: 'raw sugar',
    waterPct: 0.5,
    sucrosePct: 97.5,
    source: 'Raw and turbinado cane sugars are usually about 97–99 % sucrose with under 1 % water; we take 97.5 % and 0.5 % (from memory, no single table)',
  },
};

// ---------------------------------------------------------------------------------------------
// Stages: what sugar does in each, the usual target, and the default moisture of the material

/** What the sugar does in a stage, which decides how the numbers are judged:
 * - `keeps-dormant`: sugar holds a culture still for keeping (IMO2; IMO1 once sugar goes in).
 *   Judged by the ratio and by water activity.
 * - `draws-juice`: sugar pulls the juice out of plant or fruit material and feeds a short,
 *   wanted ferment (FPJ, FFJ). Judged by the ratio only; water activity is shown as a guide.
 * - `none`: sugar is not what keeps the batch. No target; water activity only when asked. */
export type SugarRole = 'keeps-dormant' | 'draws-juice' | 'none';

export interface StageSugarRule {
  stage: StageId;
  role: SugarRole;
  /** sugar : culture by weight, or null when the sugar rule does not apply */
  targetRatio: number | null;
  targetSource: string;
  /** default moisture of the material, g water per 100 g, or null when there is no sensible default */
  moisturePct: number | null;
  moistureSource: string;
  /** why the rule does not apply, for `none` stages (a plain sentence) */
  whyNoRule?: string;
}

const COOKED_RICE_MOISTURE = 68.44;
const COOKED_RICE_SOURCE =
  'cooked white rice, USDA SR28 NDB 20445 "Rice, white, long-grain, regular, cooked, without salt": 68.44 g water per 100 g (published)';
const EQUAL_WEIGHTS_IMO =
  'equal weights of brown sugar and culture: common practice; Park & DuPonte, University of Hawaiʻi CTAHR BIO-9 (2008) (from memory)';

export const STAGE_SUGAR_RULES: Readonly<Record<StageId, StageSugarRule>> = {
  IMO1: {
    stage: 'IMO1',
    role: 'keeps-dormant',
    targetRatio: 1,
    targetSource: `${EQUAL_WEIGHTS_IMO}; IMO1 itself is gathered without sugar, the target is for when you keep it`,
    moisturePct: COOKED_RICE_MOISTURE,
    moistureSource: COOKED_RICE_SOURCE,
  },
  IMO2: {
    stage: 'IMO2',
    role: 'keeps-dormant',
    targetRatio: 1,
    targetSource: EQUAL_WEIGHTS_IMO,
    moisturePct: COOKED_RICE_MOISTURE,
    moistureSource: COOKED_RICE_SOURCE,
  },
  IMO3: {
    stage: 'IMO3',
    role: 'none',
    targetRatio: null,
    targetSource: 'no sugar rule: the culture is spread on moist bran to multiply',
    moisturePct: 65,
    moistureSource: 'bran culture kept at about 60–70 % moisture (common practice); we take 65 %',
    whyNoRule: 'IMO3 is meant to grow on moist bran, kept below about 49 °C; sugar is not what keeps it.',
  },
  IMO4: {
    stage: 'IMO4',
    role: 'none',
    targetRatio: null,
    targetSource: 'no sugar rule: the culture is mixed with soil to multiply',
    moisturePct: 65,
    moistureSource: 'kept about as moist as IMO3, 60–70 % (common practice); we take 65 %',
    whyNoRule: 'IMO4 is meant to grow in moist soil and bran; sugar is not what keeps it.',
  },
  FPJ: {
    stage: 'FPJ',
    role: 'draws-juice',
    targetRatio: 1,
    targetSource:
      'brown sugar equal in weight to the plant material, about 7 days: Miller et al., University of Hawaiʻi CTAHR SA-7 (2013) (published)',
    moisturePct: 90,
    moistureSource:
      'fresh leafy shoots and growing tips: raw leafy vegetables in USDA SR28 are mostly 85–95 g water per 100 g (from memory); we take 90 %',
  },
  FFJ: {
    stage: 'FFJ',
    role: 'draws-juice',
    targetRatio: 1,
    targetSource: 'brown sugar equal in weight to the fruit, made like a plant juice (common practice)',
    moisturePct: 85,
    moistureSource: 'ripe fruit: raw fruits in USDA SR28 are mostly 80–90 g water per 100 g (from memory); we take 85 %',
  },
  LAB: {
    stage: 'LAB',
    role: 'none',
    targetRatio: null,
    // Some growers keep the serum with an equal weight of brown sugar, others in the fridge; the
    // serum itself is a milk ferment kept by its acidity and the cold. Setting a sugar target
    // would tell every refrigerated serum that it is short, so we do not.
    targetSource:
      'no sugar rule: the serum is 1 part rice-wash water to 10 parts milk, 3–5 days (Ikeda et al., CTAHR SA-8, 2013, published), kept by acidity and cold',
    moisturePct: 93,
    moistureSource: 'milk serum is much like fluid whey, about 93 g water per 100 g in USDA SR28 (from memory)',
    whyNoRule:
      'LAB serum is kept by its own acidity and by the cold, not by sugar; if you keep it with sugar, the water estimate still tells you how dry the mix is.',
  },
  OHN: {
    stage: 'OHN',
    role: 'none',
    targetRatio: null,
    targetSource: 'no sugar rule: herbs are extracted in beer and then spirits',
    moisturePct: null,
    moistureSource: 'no default: roots, bark and liquids differ too much; enter your own moisture to estimate',
    whyNoRule: 'OHN is kept by the alcohol it is made with, not by sugar.',
  },
  WCA: {
    stage: 'WCA',
    role: 'none',
    targetRatio: null,
    targetSource: 'no sugar rule: eggshells are dissolved in vinegar',
    moisturePct: null,
    moistureSource: 'no default: enter your own moisture to estimate',
    whyNoRule: 'WCA is shells dissolved in vinegar; it has no sugar to check.',
  },
  WCS: {
    stage: 'WCS',
    role: 'none',
    targetRatio: null,
    targetSource: 'no sugar rule: bones are dissolved in vinegar',
    moisturePct: null,
    moistureSource: 'no default: enter your own moisture to estimate',
    whyNoRule: 'WCS is bone dissolved in vinegar; it has no sugar to check.',
  },
  other: {
    stage: 'other',
    role: 'none',
    targetRatio: null,
    targetSource: 'no sugar rule for a batch we do not know',
    moisturePct: null,
    moistureSource: 'no default: enter your own moisture to estimate',
    whyNoRule: 'Sporewell has no sugar rule for this kind of batch.',
  },
};

// ---------------------------------------------------------------------------------------------
// Who can grow where

export const GROWTH_GROUP_IDS = [
  'gram-negative-bacteria',
  'bacteria',
  'gram-positive-bacteria',
  'yeasts',
  'moulds',
  'halophilic-bacteria',
  'xerophilic-moulds',
  'osmophilic-yeasts',
] as const;
export type GrowthGroupId = (typeof GROWTH_GROUP_IDS)[number];

export interface GrowthLimit {
  group: GrowthGroupId;
  label: string;
  minAw: number;
  source: string;
}

/** Minimum water activity for growth. These are lower limits under otherwise good conditions:
 * a group at or above its limit *can* grow, which is not to say it will (pH, warmth, salt and
 * competition decide the rest). Halophiles also need salt, which sugar batches lack. */
export const GROWTH_LIMITS: readonly GrowthLimit[] = [
  // Adams & Moss, Food Microbiology, Table 3.10
  { group: 'gram-negative-bacteria', label: 'Most Gram-negative bacteria', minAw: 0.97, source: 'Adams & Moss, Food Microbiology, Table 3.10' },
  // the single line most food-microbiology handbooks draw for bacteria; Beuchat (1981)
  { group: 'bacteria', label: 'Most bacteria', minAw: 0.91, source: 'Beuchat (1981); food-microbiology handbooks' },
  // Adams & Moss
  { group: 'gram-positive-bacteria', label: 'Most Gram-positive bacteria', minAw: 0.9, source: 'Adams & Moss, Food Microbiology, Table 3.10' },
  // Adams & Moss; Beuchat
  { group: 'yeasts', label: 'Most yeasts', minAw: 0.88, source: 'Adams & Moss; Beuchat (1981)' },
  // Adams & Moss; Beuchat
  { group: 'moulds', label: 'Most moulds', minAw: 0.8, source: 'Adams & Moss; Beuchat (1981)' },
  // Adams & Moss
  { group: 'halophilic-bacteria', label: 'Salt-loving (halophilic) bacteria', minAw: 0.75, source: 'Adams & Moss, Food Microbiology, Table 3.10' },
  // Adams & Moss
  { group: 'xerophilic-moulds', label: 'Dry-loving (xerophilic) moulds', minAw: 0.61, source: 'Adams & Moss, Food Microbiology, Table 3.10' },
  // lower end of Beuchat's 0.65–0.60 band
  { group: 'osmophilic-yeasts', label: 'Sugar-loving (osmophilic) yeasts', minAw: 0.6, source: 'Beuchat (1981), band 0.65–0.60' },
];

/** The picture's scale: from the lowest growth limit to pure water. */
export const WATER_ACTIVITY_SCALE = { min: 0.6, max: 1 } as const;

const limitOf = (group: GrowthGroupId): number => GROWTH_LIMITS.find((l) => l.group === group)!.minAw;
export const BACTERIA_AW_LIMIT = limitOf('bacteria');
export const YEAST_AW_LIMIT = limitOf('yeasts');
export const MOULD_AW_LIMIT = limitOf('moulds');

/** The convention: a group can grow when the estimate is at or above its minimum (`>=`). */
export function canGrowAt(estimate: number, minAw: number): boolean {
  return estimate >= minAw;
}

// ---------------------------------------------------------------------------------------------
// Water activity

/** Norrish (1966): aw = x_w · exp(−K · x_s²), with mole fractions of water and dissolved sucrose.
 * No water means no water phase; we call that 0 rather than divide by nothing. */
export function norrishWaterActivity(waterGrams: number, dissolvedSucroseGrams: number): number {
  if (waterGrams <= 0) return 0;
  const waterMoles = waterGrams / WATER_MOLAR_MASS;
  const sucroseMoles = Math.max(0, dissolvedSucroseGrams) / SUCROSE_MOLAR_MASS;
  const xs = sucroseMoles / (waterMoles + sucroseMoles);
  return (1 - xs) * Math.exp(-NORRISH_K_SUCROSE * xs * xs);
}

export interface SucroseMix {
  estimate: number;
  dissolvedSucroseGrams: number;
  undissolvedSucroseGrams: number;
  saturated: boolean;
}

/** Water activity of water holding some sucrose, dissolving no more than the water can take:
 * undissolved crystals do not lower water activity, so past saturation the estimate stops. */
export function sucroseMixWaterActivity(waterGrams: number, sucroseGrams: number): SucroseMix {
  const capacity = Math.max(0, waterGrams) * (SUCROSE_SOLUBILITY_PER_100G_WATER / 100);
  const dissolved = Math.min(Math.max(0, sucroseGrams), capacity);
  return {
    estimate: norrishWaterActivity(waterGrams, dissolved),
    dissolvedSucroseGrams: dissolved,
    undissolvedSucroseGrams: Math.max(0, sucroseGrams - dissolved),
    saturated: sucroseGrams >= capacity && waterGrams > 0,
  };
}

/** The lowest water activity sugar alone can reach (a saturated solution at 20 °C), about 0.85. */
export const SATURATED_WATER_ACTIVITY = norrishWaterActivity(100, SUCROSE_SOLUBILITY_PER_100G_WATER);

function mixOf(cultureGrams: number, moistureFraction: number, sugarGrams: number, sugar: SugarType) {
  const waterGrams = cultureGrams * moistureFraction + sugarGrams * (sugar.waterPct / 100);
  const sucroseGrams = sugarGrams * (sugar.sucrosePct / 100);
  return { waterGrams, sucroseGrams, ...sucroseMixWaterActivity(waterGrams, sucroseGrams) };
}

/** Grams of sugar in all (not extra) that bring this culture down to `targetAw`. 0 when the
 * culture is already that dry; null when sugar alone cannot get there (below saturation, or no
 * water to dissolve it in). Bisection: water activity falls steadily with sugar up to saturation. */
export function sugarNeededForWaterActivity(
  targetAw: number,
  cultureGrams: number,
  moistureFraction: number,
  sugarType: SugarTypeId = 'brown',
): number | null {
  const sugar = SUGAR_TYPES[sugarType];
  const at = (sugarGrams: number) => mixOf(cultureGrams, moistureFraction, sugarGrams, sugar).estimate;
  if (at(0) <= targetAw) return 0;
  const cultureWater = cultureGrams * moistureFraction;
  if (cultureWater <= 0) return null;
  // Sugar at which the water, including the sugar's own, is just saturated.
  const solubility = SUCROSE_SOLUBILITY_PER_100G_WATER / 100;
  const saturatingSugar = (solubility * cultureWater) / (sugar.sucrosePct / 100 - solubility * (sugar.waterPct / 100));
  if (at(saturatingSugar) > targetAw) return null;
  let low = 0;
  let high = saturatingSugar;
  for (let i = 0; i < 100 && high - low > 1e-9 * saturatingSugar; i++) {
    const mid = (low + high) / 2;
    if (at(mid) > targetAw) low = mid;
    else high = mid;
  }
  return high;
}

// ---------------------------------------------------------------------------------------------
// Input

/** Past this a number is a typing slip, not a batch (either weight, in any unit). */
export const MAX_BATCH_GRAMS = 1_000_000;


// ---------------------------------------------------------------------------------------------
// Result

export interface MassReading {
  grams: number;
  value: number;
  unit: MassUnit;
}

export interface WaterActivityEstimate {
  estimate: number;
  waterGrams: number;
  sucroseGrams: number;
  dissolvedSucroseGrams: number;
  undissolvedSucroseGrams: number;
  saturated: boolean;
  moisturePct: number;
  moistureSource: string;
}

export interface GrowthLine {
  group: GrowthGroupId;
  label: string;
  minAw: number;
  /** null when there is no estimate (no moisture known for this stage) */
  canGrow: boolean | null;
}

export type BatchRisk = 'low' | 'medium' | 'high';

export interface BatchCheckResult {
  stage: StageId;
  role: SugarRole;
  sugarType: SugarTypeId;
  /** sugar : culture by weight */
  ratio: number;
  targetRatio: number | null;
  /** 0 when at or above target (within RATIO_TOLERANCE) or when no target applies */
  sugarToAdd: MassReading;
  scaleReading: {
    /** culture + the sugar it ends with (the larger of what is in and the target) */
    zeroed: MassReading;
    withContainer: MassReading | null;
  };
  /** null when the stage has no default moisture and none was given */
  waterActivity: WaterActivityEstimate | null;
  growth: GrowthLine[];
  risk: BatchRisk;
  discardSigns: SymptomId[];
  verdict: string;
  notes: string[];
  cautions: string[];
}

/** Within 1 % of the target counts as on target: a kitchen scale and a sticky spoon do not do better. */
export const RATIO_TOLERANCE = 0.01;

/** How the risk is decided (see `riskOf`). */
export const RISK_RULES = {
  /** below this share of the target ratio the batch is badly short of sugar */
  highBelowTargetShare: 0.75,
  /** at or above: most bacteria can grow in a kept culture */
  highFromAw: BACTERIA_AW_LIMIT,
  /** at or above: most yeasts can grow */
  mediumFromAw: YEAST_AW_LIMIT,
} as const;

/** Risk from the numbers:
 * - any discard sign among the symptoms: high (the batch has spoiled, whatever the numbers);
 * - keeps-dormant (IMO2, IMO1 once sugar is in): high when water activity ≥ 0.91 (bacteria can
 *   grow) or the ratio is under 0.75 of the target; medium when ≥ 0.88 (yeasts can) or short of
 *   the target; low otherwise;
 * - draws-juice (FPJ, FFJ): judged by the ratio alone, with the same 0.75 and target lines,
 *   because a plant juice is meant to ferment for its first week;
 * - no sugar rule, or IMO1 still being gathered: low — the numbers raise no alarm, and the
 *   symptoms speak for the batch through the urgency score. */
export function riskOf(args: {
  role: SugarRole;
  ratio: number;
  targetRatio: number | null;
  aw: number | null;
  gathering: boolean;
  hasDiscardSign: boolean;
}): BatchRisk {
  if (args.hasDiscardSign) return 'high';
  if (args.role === 'none' || args.targetRatio === null || args.gathering) return 'low';
  const share = args.ratio / args.targetRatio;
  const short = share < 1 - RATIO_TOLERANCE;
  if (share < RISK_RULES.highBelowTargetShare) return 'high';
  if (args.role === 'keeps-dormant' && args.aw !== null) {
    if (args.aw >= RISK_RULES.highFromAw) return 'high';
    if (args.aw >= RISK_RULES.mediumFromAw) return 'medium';
  }
  return short ? 'medium' : 'low';
}

const reading = (grams: number, unit: MassUnit): MassReading => ({ grams, value: fromGrams(grams, unit), unit });

function listWords(words: string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

/** "most bacteria, yeasts and moulds can still grow" — the three lines a grower knows. */
function whoCanGrow(aw: number): string {
  const groups = [
    { words: 'most bacteria', minAw: BACTERIA_AW_LIMIT },
    { words: 'most yeasts', minAw: YEAST_AW_LIMIT },
    { words: 'most moulds', minAw: MOULD_AW_LIMIT },
  ].filter((g) => canGrowAt(aw, g.minAw));
  if (groups.length === 0) {
    return 'that is below what most bacteria, yeasts and moulds need; only sugar-loving yeasts and dry-loving moulds could still grow';
  }
  const names = groups.map((g, i) => (i === 0 ? g.words : g.words.replace('most ', '')));
  // Within a hundredth under the bacteria line the batch is held, but only just.
  const justHeld = !canGrowAt(aw, BACTERIA_AW_LIMIT) && aw >= BACTERIA_AW_LIMIT - 0.01 ? ', and most bacteria are held at about their limit' : '';
  return `${listWords(names)} can still grow${justHeld}`;
}

/** Check a batch whose input `batchCheckInputSchema` (batch-check.ts) has already validated,
 * defaults filled in; `checkBatch` there validates first. */
export function checkValidBatch(parsed: BatchCheckParsed): BatchCheckResult {
  const rule = STAGE_SUGAR_RULES[parsed.stage];
  const sugar = SUGAR_TYPES[parsed.sugarType];
  const unit = parsed.sugar.unit;
  const fmt = (grams: number) => formatMass(grams, unit);

  const cultureGrams = toGrams(parsed.culture.value, parsed.culture.unit);
  const sugarGrams = toGrams(parsed.sugar.value, parsed.sugar.unit);
  const containerGrams = parsed.containerWeight ? toGrams(parsed.containerWeight.value, parsed.containerWeight.unit) : null;
  const ratio = sugarGrams / cultureGrams;
  const targetRatio = rule.targetRatio;
  const gathering = parsed.stage === 'IMO1' && sugarGrams === 0;

  const targetGrams = targetRatio === null ? null : targetRatio * cultureGrams;
  const onTarget = targetRatio !== null && ratio >= targetRatio * (1 - RATIO_TOLERANCE);
  const addGrams = targetGrams === null || onTarget || gathering ? 0 : targetGrams - sugarGrams;
  const zeroedGrams = cultureGrams + sugarGrams + addGrams;

  const moisturePct = parsed.moisturePct ?? rule.moisturePct;
  const moistureSource = parsed.moisturePct !== undefined ? 'the moisture you entered' : rule.moistureSource;
  const waterActivity: WaterActivityEstimate | null =
    moisturePct === null
      ? null
      : { ...mixOf(cultureGrams, moisturePct / 100, sugarGrams, sugar), moisturePct, moistureSource };
  const aw = waterActivity?.estimate ?? null;

  const discardSigns = discardSignsIn(parsed.symptoms ?? []);
  const risk = riskOf({ role: rule.role, ratio, targetRatio, aw, gathering, hasDiscardSign: discardSigns.length > 0 });

  const notes: string[] = [];
  const discard = discardNote(discardSigns);
  if (discard) notes.push(discard);

  // Sugar against the rule.
  const stage = parsed.stage;
  if (targetRatio === null) {
    notes.push(`The sugar rule does not apply here. ${rule.whyNoRule ?? ''}`.trim());
  } else if (gathering) {
    notes.push(
      `IMO1 is gathered without sugar. When you want to keep it, mix in an equal weight of ${sugar.label} — about ${fmt(targetGrams!)} — and it becomes IMO2.`,
    );
  } else {
    notes.push(
      `There is ${fmt(sugarGrams)} of ${sugar.label} to ${formatMass(cultureGrams, parsed.culture.unit)} of ${stage === 'FPJ' || stage === 'FFJ' ? 'material' : 'culture'} (${ratio.toFixed(2)} : 1); the usual rule for ${stage} is ${targetRatio === 1 ? 'equal weights' : `${targetRatio} : 1`}.`,
    );
    if (addGrams > 0 && discardSigns.length === 0) {
      notes.push(`Mix in or top-dress about ${fmt(addGrams)} more ${sugar.label}, then check again tomorrow.`);
    }
  }
  if (targetRatio !== null && !gathering && discardSigns.length === 0) {
    const withContainer = containerGrams === null ? '' : ` (${fmt(zeroedGrams + containerGrams)} with the container on the scale)`;
    notes.push(`With the container zeroed, the scale should read about ${fmt(zeroedGrams)} at the end${withContainer}.`);
  }

  // Water.
  if (waterActivity === null) {
    notes.push('Enter the moisture of the material (in percent) to estimate how much water is free for microbes.');
  } else {
    notes.push(`Estimated water activity about ${waterActivity.estimate.toFixed(3)}: ${whoCanGrow(waterActivity.estimate)}.`);
    if (waterActivity.saturated) {
      notes.push(
        `There is more sugar than the water can dissolve (about 2 g of sugar per gram of water at 20 °C), so about ${fmt(waterActivity.undissolvedSucroseGrams)} stays undissolved and does not dry the batch further. The estimate stays near 0.85, where most moulds can still grow: sugar alone cannot stop moulds. Keep it cool, covered and out of the sun.`,
      );
    } else if (rule.role === 'keeps-dormant' && !gathering && onTarget && waterActivity.estimate >= BACTERIA_AW_LIMIT) {
      const needed = sugarNeededForWaterActivity(0.9, cultureGrams, moisturePct! / 100, parsed.sugarType);
      if (needed !== null && needed > sugarGrams) {
        notes.push(
          `The culture is wetter than cooked rice, so equal weights still leave room for bacteria. About ${fmt(needed - sugarGrams)} more ${sugar.label} would bring it near 0.90; pouring off free liquid helps too.`,
        );
      }
    }
    if (rule.role === 'draws-juice') {
      notes.push(`A ${stage === 'FPJ' ? 'plant' : 'fruit'} juice is meant to ferment gently for about a week, so its water activity is a guide here, not a target.`);
    }
    notes.push('The estimate counts only sugar and water; the material’s own salts and sugars make it a little drier than this.');
  }

  const verdict = verdictOf({ stage, role: rule.role, risk, gathering, discardSigns, addText: fmt(addGrams), addGrams, sugarLabel: sugar.label, aw, whyNoRule: rule.whyNoRule, targetText: targetGrams === null ? '' : fmt(targetGrams) });

  return {
    stage,
    role: rule.role,
    sugarType: parsed.sugarType,
    ratio,
    targetRatio,
    sugarToAdd: reading(addGrams, unit),
    scaleReading: {
      zeroed: reading(zeroedGrams, unit),
      withContainer: containerGrams === null ? null : reading(zeroedGrams + containerGrams, unit),
    },
    waterActivity,
    growth: GROWTH_LIMITS.map((limit) => ({
      group: limit.group,
      label: limit.label,
      minAw: limit.minAw,
      canGrow: aw === null ? null : canGrowAt(aw, limit.minAw),
    })),
    risk,
    discardSigns,
    verdict,
    notes,
    cautions: [...SAFETY_CAUTIONS],
  };
}

function verdictOf(v: {
  stage: StageId;
  role: SugarRole;
  risk: BatchRisk;
  gathering: boolean;
  discardSigns: DiscardSign[];
  addText: string;
  addGrams: number;
  sugarLabel: string;
  aw: number | null;
  whyNoRule?: string;
  targetText: string;
}): string {
  if (v.discardSigns.length > 0) {
    const words = v.discardSigns.map((s) => DISCARD_SIGN_WORDS[s]);
    return `Discard this batch: ${listWords(words)} means it has spoiled, whatever the numbers say.`;
  }
  if (v.role === 'none') return `The sugar rule does not apply to ${v.stage}; judge it by smell, colour, texture and warmth.`;
  if (v.gathering) return `No sugar yet, which is normal while you gather IMO1; add an equal weight (${v.targetText}) when you want to keep it.`;
  const add = v.addGrams > 0 ? ` — add about ${v.addText} more ${v.sugarLabel}` : '';
  if (v.role === 'draws-juice') {
    if (v.risk === 'high') return `Far too little sugar for ${v.stage}${add} now.`;
    if (v.risk === 'medium') return `A little short of sugar for ${v.stage}${add}, then check again tomorrow.`;
    return `Sugar is at the usual equal weight for ${v.stage}; let it ferment about a week in a cool, shaded place under a breathable cover.`;
  }
  if (v.risk === 'high') {
    return v.addGrams > 0
      ? `Too little sugar: bacteria can still grow in this batch${add}.`
      : 'Bacteria can still grow in this batch: it is too wet for its sugar.';
  }
  if (v.risk === 'medium') {
    return v.addGrams > 0
      ? `A little short of sugar${add}, then check again tomorrow.`
      : 'Sugar is at the usual equal weight: bacteria are held back, but yeasts and moulds can still grow slowly, so keep it cool and watch it.';
  }
  return 'Sugar is at or above the usual rule and holds back most bacteria and yeasts; moulds can still grow slowly, so keep it cool and covered.';
}
