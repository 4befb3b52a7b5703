// The e-mails of closing: one when the case is closed and one per check-in, each with a link
// straight to the recovery report. They go through the outbox in the caller's transaction.
import type { Transaction } from 'sequelize';
import { CAUSES, REMEDIES, labelOf } from '../../../shared/vocabulary';
import { enqueueMail } from '../mail/outbox';

export function recoveryReportUrl(publicUrl: string, caseId: number): string {
  return `${publicUrl}/cases/${caseId}/recovery-report`;
}

const SAFETY_LINE =
  'Stay safe: wear a mask around mouldy cultures and wash your hands afterwards. A batch that smells putrid, or grows black, pink or slimy, is to be discarded, not rescued.';

function daysText(days: readonly number[]): string {
  if (days.length === 1) return `${days[0]} ${days[0] === 1 ? 'day' : 'days'}`;
  return `${days.slice(0, -1).join(', ')} and ${days[days.length - 1]} days`;
}

export async function queueClosedMail(
  input: {
    publicUrl: string;
    caseId: number;
    title: string;
    to: string;
    growerName: string;
    closerName: string;
    cause: string;
    remedy: string;
    remedyNotes: string;
    summary: string;
    checkInDays: readonly number[];
  },
  transaction: Transaction,
): Promise<boolean> {
  const lines = [
    `Hello ${input.growerName},`,
    '',
    `${input.closerName} closed your case “${input.title}” with a remedy to try.`,
    '',
    `Likely cause: ${labelOf(CAUSES, input.cause)}`,
    `Remedy: ${labelOf(REMEDIES, input.remedy)}${input.remedyNotes ? ` — ${input.remedyNotes}` : ''}`,
    '',
    `In short: ${input.summary}`,
    '',
    'Over the next days, tell us how the batch does: recovered, partly, or lost. It takes a minute:',
    recoveryReportUrl(input.publicUrl, input.caseId),
    '',
    `We will remind you after ${daysText(input.checkInDays)} unless you answer first.`,
    '',
    SAFETY_LINE,
    '',
    '— Sporewell',
  ];
  return enqueueMail(
    { to: input.to, subject: `Your case is closed: tell us how “${input.title}” does`, text: lines.join('\n'), kind: 'case_closed', dedupeKey: `case-closed:${input.caseId}` },
    transaction,
  );
}

export async function queueCheckInMail(
  input: { publicUrl: string; caseId: number; day: number; title: string; to: string; growerName: string },
  transaction: Transaction,
): Promise<boolean> {
  const lines = [
    `Hello ${input.growerName},`,
    '',
    `It is ${input.day} ${input.day === 1 ? 'day' : 'days'} since your case “${input.title}” was closed. How is the batch doing?`,
    '',
    'Tell us whether it recovered, partly recovered or was lost, and how helpful the advice was:',
    recoveryReportUrl(input.publicUrl, input.caseId),
    '',
    'If it is too early to say, wait for the next reminder.',
    '',
    SAFETY_LINE,
    '',
    '— Sporewell',
  ];
  return enqueueMail(
    {
      to: input.to,
      subject: `Day ${input.day}: how is “${input.title}” doing?`,
      text: lines.join('\n'),
      kind: 'check_in',
      dedupeKey: `check-in:${input.caseId}:${input.day}`,
    },
    transaction,
  );
}
