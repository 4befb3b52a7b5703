import { describe, expect, test } from 'vitest';
import { slipsOf } from '../../server/src/modules/cases/search-index';

describe('slipsOf: the words one slip of the finger away', () => {
  test('when two neighbouring letters are swapped, then the word they were meant to be is among the slips', () => {
    expect(slipsOf('laeve')).toContain('leave');
    expect(slipsOf('cluody')).toContain('cloudy');
    expect(slipsOf('gorund')).toContain('ground');
  });

  test('when a letter is doubled or stray, then dropping it is among the slips; the word itself never is', () => {
    expect(slipsOf('cloudyy')).toContain('cloudy');
    expect(slipsOf('suggar')).toContain('sugar');
    expect(slipsOf('sugar')).not.toContain('sugar');
  });

  test('when the word is three letters, then nothing is dropped (two letters are not a word the index keeps), and each slip is listed once', () => {
    expect(slipsOf('lab')).toEqual(['alb', 'lba']);
    const slips = slipsOf('bubbles');
    expect(new Set(slips).size).toBe(slips.length);
    // 6 swaps less the one of the two b's, and 7 drops less the repeat of dropping either b.
    expect(slips.length).toBe(5 + 6);
  });
});
