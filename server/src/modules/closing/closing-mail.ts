// The e-mails of closing: one when the case is closed and one per check-in, each with a link
// straight to the recovery report. They go through the outbox in the caller's transaction.
import type { Transaction } from 'sequelize';
import { casePath } from '../../../shared/case-links';
import { CAUSES, REMEDIES, labelOf } from '../../../shared/vocabulary';
import { enqueueMail } from '../mail/outbox';

export function recoveryReportUrl(publicUrl: string, caseId: number): string {
  return `${publicUrl}${casePath(caseId)}/recovery-report`;
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

/**
 * A steward took the grower's field note out of the Field Library, or put it back: the grower
 * shared it, so they are told, with the reason given. `heldAt` keys the mail to that one hold.
 */
export async function queueLibraryHoldMail(
  input: { publicUrl: string; caseId: number; title: string; to: string; growerName: string; stewardName: string; reason: string; heldAt: Date; change: 'taken_out' | 'put_back' },
  transaction: Transaction,
): Promise<boolean> {
  const takenOut = input.change === 'taken_out';
  const lines = takenOut
    ? [
        `Hello ${input.growerName},`,
        '',
        `${input.stewardName}, a steward of the Field Library, took the field note of your case “${input.title}” out of the library. Until a steward puts it back, it is not in the library's search, nor shown to other growers beside batches like yours.`,
        '',
        `The reason given: “${input.reason}”`,
        '',
        'Your case, its advice and its conversation stay on your case page, and you still choose whether it is shared:',
        `${input.publicUrl}${casePath(input.caseId)}`,
        '',
        '— Sporewell',
      ]
    : [
        `Hello ${input.growerName},`,
        '',
        `${input.stewardName}, a steward of the Field Library, put the field note of your case “${input.title}” back in the library, where other growers can read it again, without your name, e-mail or place.`,
        '',
        'You can stop sharing it at any time from your case page:',
        `${input.publicUrl}${casePath(input.caseId)}`,
        '',
        '— Sporewell',
      ];
  return enqueueMail(
    {
      to: input.to,
      subject: takenOut ? `Your field note is out of the Field Library: “${input.title}”` : `Your field note is back in the Field Library: “${input.title}”`,
      text: lines.join('\n'),
      kind: takenOut ? 'note_taken_out' : 'note_put_back',
      dedupeKey: `library-hold:${input.caseId}:${input.heldAt.toISOString()}:${input.change}`,
    },
    transaction,
  );
}
