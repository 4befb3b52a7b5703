import { useMemo } from 'react';
import { batchCheckInputSchema, checkBatch, type BatchCheckResult } from '@shared/batch-check';
import type { MassUnit } from '@shared/units';

/** What a form holds while the grower types: anything may be missing or half-typed. Number
 * inputs read as NaN when empty. */
export interface BatchCheckDraft {
  stage?: string | null;
  culture?: { value?: number | null; unit?: MassUnit | null } | null;
  sugar?: { value?: number | null; unit?: MassUnit | null } | null;
  sugarType?: string | null;
  moisturePct?: number | null;
  containerWeight?: { value?: number | null; unit?: MassUnit | null } | null;
  symptoms?: readonly string[] | null;
}

export type LiveBatchCheck =
  | { state: 'ready'; result: BatchCheckResult }
  /** Not enough yet: `needs` says in plain words what to fill in. */
  | { state: 'incomplete'; needs: string[] };

const given = (n: number | null | undefined): n is number => typeof n === 'number' && Number.isFinite(n);

export function liveBatchCheck(draft: BatchCheckDraft): LiveBatchCheck {
  const needs: string[] = [];
  if (!draft.stage) needs.push('the stage');
  if (!given(draft.culture?.value) || draft.culture.value <= 0) needs.push('the culture weight');
  if (!given(draft.sugar?.value)) needs.push('the sugar weight (0 if none yet)');
  if (needs.length > 0) return { state: 'incomplete', needs };

  const container = draft.containerWeight;
  const input = {
    stage: draft.stage,
    culture: { value: draft.culture!.value, unit: draft.culture!.unit ?? 'g' },
    sugar: { value: draft.sugar!.value, unit: draft.sugar!.unit ?? 'g' },
    sugarType: draft.sugarType || undefined,
    moisturePct: given(draft.moisturePct) ? draft.moisturePct : undefined,
    containerWeight: container && given(container.value) ? { value: container.value, unit: container.unit ?? 'g' } : undefined,
    symptoms: draft.symptoms ? [...draft.symptoms] : undefined,
  };
  const parsed = batchCheckInputSchema.safeParse(input);
  if (!parsed.success) return { state: 'incomplete', needs: [...new Set(parsed.error.issues.map((issue) => issue.message))] };
  return { state: 'ready', result: checkBatch(parsed.data) };
}

/** The sugar & water check, recomputed in the browser on every keystroke (it is a few dozen
 * arithmetic steps, so there is nothing to debounce and no round trip to wait for). */
export function useLiveBatchCheck(draft: BatchCheckDraft): LiveBatchCheck {
  // Keyed on the draft's content: forms hand over a new object on every render.
  const key = JSON.stringify(draft);
  return useMemo(() => liveBatchCheck(JSON.parse(key) as BatchCheckDraft), [key]);
}
