import { useEffect, useRef, useState, type ReactNode } from 'react';
import type { CaseDetail } from '@shared/case-schemas';
import { CASE_STATUSES, OPEN_STATUSES, STATUS_LABELS, canMove, isStaffRole, type CaseStatus, type Role } from '@shared/case-status';
import type { PublicUser } from '@shared/auth-schemas';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { useClaimCase } from '../api/claim-case';
import { useHandOverCase } from '../api/hand-over-case';
import { useMoveCaseStatus } from '../api/move-case-status';
import { HandOverForm } from './hand-over-form';

/** The words on a move's button, by where it leads (and, for one, where it comes from). */
function moveWords(from: CaseStatus, to: CaseStatus): string {
  if (to === 'in_conversation') return from === 'awaiting_mentor' ? 'Start the conversation' : 'Back in conversation';
  if (to === 'over_to_grower') return 'Over to the grower';
  if (to === 'withdrawn') return 'Withdraw this case';
  return `Move to “${STATUS_LABELS[to]}”`;
}

export interface WorkflowBarProps {
  detail: Pick<CaseDetail, 'id' | 'status' | 'grower' | 'mentor'>;
  user: PublicUser;
  /**
   * Slot for closing the case (PRODUCT.md screen 6: cause, remedy, summary → "Watching"). The
   * closing work renders its action here; until then nothing is shown in its place.
   */
  closeCaseAction?: ReactNode;
}

/** Claim, hand over, move along the workflow, withdraw: only what the viewer's role may do. */
export function WorkflowBar({ detail, user, closeCaseAction }: WorkflowBarProps) {
  const claim = useClaimCase();
  const move = useMoveCaseStatus();
  const handOver = useHandOverCase();
  const [confirmWithdraw, setConfirmWithdraw] = useState(false);
  // Buttons here give way to others (claim, withdraw and its question); focus follows to what
  // replaced them instead of dropping to the top of the page.
  const [focusNext, setFocusNext] = useState<'holder' | 'question' | 'withdraw' | null>(null);
  const holderRef = useRef<HTMLParagraphElement>(null);
  const keepOpenRef = useRef<HTMLButtonElement>(null);
  const withdrawRef = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    if (!focusNext) return;
    ({ holder: holderRef, question: keepOpenRef, withdraw: withdrawRef })[focusNext].current?.focus();
    setFocusNext(null);
  }, [focusNext]);

  // Someone who opened the case acts on it as its grower, whatever else they are (as the server does).
  const role: Role = detail.grower.id === user.id ? 'grower' : user.role;
  const status = detail.status;
  const open = OPEN_STATUSES.includes(status);
  const heldByMe = detail.mentor?.id === user.id;
  const heldByOther = detail.mentor !== null && !heldByMe;
  const staff = isStaffRole(role);
  const canClaim = staff && open && detail.mentor === null;
  // The server's rule (workflow.service.ts): the mentor who holds the case, or a steward.
  const canHandOver = open && (role === 'steward' || (role === 'mentor' && heldByMe));

  const moves = CASE_STATUSES.filter((to) => {
    if (!canMove(status, to, role)) return false;
    // A grower's own reply brings the case back into conversation; no button needed.
    if (role === 'grower' && to === 'in_conversation') return false;
    // Claiming does what "start the conversation" would, and says who took it.
    if (canClaim && to === 'in_conversation' && status === 'awaiting_mentor') return false;
    // The server refuses a mentor moving a case another mentor holds.
    if (role === 'mentor' && heldByOther) return false;
    return true;
  });
  const forward = moves.filter((to) => to !== 'withdrawn');
  const canWithdraw = moves.includes('withdrawn');
  const error = claim.error ?? move.error ?? handOver.error;
  const busy = claim.isPending || move.isPending || handOver.isPending;

  // A case that ended (recovered, lost, withdrawn) is no longer held by anyone; say who did.
  const ended = !open && status !== 'watching';
  const holder = detail.mentor
    ? heldByMe
      ? ended
        ? 'You held this case.'
        : 'You hold this case.'
      : `${detail.mentor.displayName} ${ended ? 'held' : 'holds'} this case.`
    : open
      ? 'No mentor has taken this case yet.'
      : null;

  const nothingToDo = !canClaim && forward.length === 0 && !canWithdraw && !canHandOver && !closeCaseAction;

  return (
    <div className="flex flex-col gap-3 rounded-soft border border-line bg-rice p-3 sm:p-4">
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        {holder && (
          <p ref={holderRef} tabIndex={-1} className="font-bold">
            {holder}
          </p>
        )}
        {role === 'grower' && status === 'over_to_grower' && (
          <p className="text-loam-soft">The mentor is waiting for your answer. Replying puts the case back in conversation.</p>
        )}
      </div>
      {!nothingToDo && (
        <div className="flex flex-wrap items-end gap-2">
          {canClaim && (
            <Button onClick={() => claim.mutate(detail.id, { onSuccess: () => setFocusNext('holder') })} disabled={busy}>
              {claim.isPending ? 'Claiming…' : 'Claim this case'}
            </Button>
          )}
          {forward.map((to) => (
            <Button key={to} variant="secondary" onClick={() => move.mutate({ caseId: detail.id, status: to })} disabled={busy}>
              {moveWords(status, to)}
            </Button>
          ))}
          {closeCaseAction}
          {canHandOver && (
            <HandOverForm
              currentMentorId={detail.mentor?.id ?? null}
              growerId={detail.grower.id}
              busy={busy}
              onHandOver={(mentorId) => handOver.mutate({ caseId: detail.id, mentorId })}
            />
          )}
          {canWithdraw && !confirmWithdraw && (
            <Button
              ref={withdrawRef}
              variant="quiet"
              className="px-3!"
              onClick={() => {
                setConfirmWithdraw(true);
                setFocusNext('question');
              }}
              disabled={busy}
            >
              {moveWords(status, 'withdrawn')}
            </Button>
          )}
        </div>
      )}
      {confirmWithdraw && (
        <div role="group" aria-label="Withdraw this case" className="flex flex-wrap items-center gap-3 rounded-soft border-l-8 border-clay bg-clay-mist px-4 py-3">
          <p className="font-semibold">
            {role === 'grower'
              ? 'Withdraw this case? Mentors stop seeing it on their rounds. You can open a new case any time.'
              : 'Withdraw this case? It leaves the rounds and its thread takes no new messages.'}
          </p>
          <div className="flex gap-2">
            <Button
              variant="danger"
              disabled={busy}
              onClick={() => move.mutate({ caseId: detail.id, status: 'withdrawn' }, { onSettled: () => setConfirmWithdraw(false) })}
            >
              {move.isPending ? 'Withdrawing…' : 'Yes, withdraw'}
            </Button>
            <Button
              ref={keepOpenRef}
              variant="secondary"
              onClick={() => {
                setConfirmWithdraw(false);
                setFocusNext('withdraw');
              }}
            >
              Keep it open
            </Button>
          </div>
        </div>
      )}
      {error && (
        <Alert tone="danger" title="That did not go through">
          {error.message}
        </Alert>
      )}
    </div>
  );
}
