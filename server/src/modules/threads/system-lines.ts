// The words of the thread's system lines for status changes, in one place: the workflow and
// closing services write them as the changes happen, and the demo seed writes the same lines
// into the history it makes, so a seeded thread reads like one that went through the product.
import { STATUS_LABELS, type CaseStatus } from '../../../shared/case-status';
import { OUTCOME_LABELS, type Outcome } from '../../../shared/closing-schemas';
import { CAUSES, REMEDIES, labelOf } from '../../../shared/vocabulary';

const label = (status: string) => STATUS_LABELS[status as CaseStatus] ?? status;

export const claimedLine = (actor: string) => `${actor} took this case.`;

export const handedOverLine = (actor: string, to: string) => `${actor} handed this case to ${to}.`;

export function movedLine(actor: string, from: string, to: string, tookIt = false): string {
  const line = `${actor} moved the case from “${label(from)}” to “${label(to)}”.`;
  return tookIt ? `${line} ${actor} now holds it.` : line;
}

function dayList(days: readonly number[]): string {
  return days.length === 1 ? `day ${days[0]}` : `days ${days.slice(0, -1).join(', ')} and ${days.at(-1)}`;
}

export function closedLine(actor: string, values: { cause: string; remedy: string; checkInDays: readonly number[] }): string {
  return (
    `${actor} closed the case. Likely cause: ${labelOf(CAUSES, values.cause)}. Remedy: ${labelOf(REMEDIES, values.remedy)}. ` +
    `The case is now “${STATUS_LABELS.watching}”; the grower will be asked how the batch does on ${dayList(values.checkInDays)}.`
  );
}

export function recoveryReportLine(actor: string, report: { outcome: Outcome; stars: number; consentToPublish: boolean }): string {
  const status: CaseStatus = report.outcome === 'lost' ? 'lost' : 'recovered';
  const shared = report.consentToPublish ? ' They agreed to share it, so it is now an anonymised field note in the Field Library.' : '';
  return `${actor} filed the recovery report: ${OUTCOME_LABELS[report.outcome]}, ${report.stars} of 5 stars for the advice. The case is now “${STATUS_LABELS[status]}”.${shared}`;
}
