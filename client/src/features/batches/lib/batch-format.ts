import { STAGES, labelOf } from '@shared/vocabulary';
import { dayMonthYear } from '../../../lib/english-dates';

/** "IMO2" → "IMO2 — culture kept with sugar" */
export function stageLabel(stage: string): string {
  return labelOf(STAGES, stage);
}

export function ageText(days: number): string {
  if (days === 0) return 'made today';
  return days === 1 ? '1 day' : `${days} days`;
}

/** "3 March 2026", read as a calendar day (no time-zone shift). */
export function formatMadeOn(madeOn: string, style: 'long' | 'short' = 'long'): string {
  const [y, m, d] = madeOn.split('-').map(Number);
  return dayMonthYear(y, m, d, style);
}

/** Today as YYYY-MM-DD in the grower's time zone, for a date input's default. */
export function todayIso(today = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${today.getFullYear()}-${pad(today.getMonth() + 1)}-${pad(today.getDate())}`;
}
