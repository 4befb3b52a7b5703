import { describe, expect, test } from 'vitest';
import { CASE_STATUSES, OPEN_STATUSES, RESOLVED_STATUSES, ROLES, STATUS_LABELS, canMove, isLegalMove } from '@shared/case-status';

describe('case moves', () => {
  test('when a grower tries to claim a waiting case, then it is refused, and a mentor or steward may', () => {
    expect(canMove('awaiting_mentor', 'in_conversation', 'grower')).toBe(false);
    expect(canMove('awaiting_mentor', 'in_conversation', 'mentor')).toBe(true);
    expect(canMove('awaiting_mentor', 'in_conversation', 'steward')).toBe(true);
  });

  test('when the conversation passes back and forth, then mentors hand over and anyone in it hands back', () => {
    expect(canMove('in_conversation', 'over_to_grower', 'mentor')).toBe(true);
    expect(canMove('in_conversation', 'over_to_grower', 'grower')).toBe(false);
    for (const role of ROLES) expect(canMove('over_to_grower', 'in_conversation', role)).toBe(true);
  });

  test('when an open case is withdrawn, then the grower or a steward may do it but not a mentor', () => {
    for (const from of OPEN_STATUSES) {
      expect(canMove(from, 'withdrawn', 'grower')).toBe(true);
      expect(canMove(from, 'withdrawn', 'steward')).toBe(true);
      expect(canMove(from, 'withdrawn', 'mentor')).toBe(false);
    }
  });

  test('when a case is watching, ended or withdrawn, then no hand move leads out of it', () => {
    for (const from of ['watching', ...RESOLVED_STATUSES, 'withdrawn'] as const) {
      for (const to of CASE_STATUSES) {
        expect(isLegalMove(from, to)).toBe(false);
        for (const role of ROLES) expect(canMove(from, to, role)).toBe(false);
      }
    }
  });

  test('when watching, recovered or lost are reached by hand, then it is refused (closing and reports do that)', () => {
    for (const from of CASE_STATUSES) {
      for (const to of ['watching', 'recovered', 'lost'] as const) expect(isLegalMove(from, to)).toBe(false);
    }
  });

  test('when a move is allowed for some role, then it is a legal move', () => {
    for (const from of CASE_STATUSES) {
      for (const to of CASE_STATUSES) {
        if (ROLES.some((role) => canMove(from, to, role))) expect(isLegalMove(from, to)).toBe(true);
      }
    }
  });

  test('when a status is shown, then it has a label', () => {
    for (const status of CASE_STATUSES) expect(STATUS_LABELS[status].length).toBeGreaterThan(0);
  });
});
