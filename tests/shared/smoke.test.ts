import { describe, expect, test } from 'vitest';
import { canMove } from '@shared/case-status';
describe('case moves', () => {
  test('when a grower tries to claim, then it is refused', () => {
    expect(canMove('awaiting_mentor', 'in_conversation', 'grower')).toBe(false);
    expect(canMove('awaiting_mentor', 'in_conversation', 'mentor')).toBe(true);
  });
});
