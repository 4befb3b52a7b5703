// The steward desk's readings of its charts: whoever holds the most, and the strongest recovery
// record, are named; a tie at the top names (or counts) everyone in it.
import { describe, expect, test } from 'vitest';
import { busiestText, strongestLead } from '../../client/src/features/steward/lib/summary-words';

const load = (displayName: string, open: number, watching: number) => ({ displayName, open, watching });

describe('the busiest mentor in words', () => {
  test('when one mentor holds the most open cases, then that mentor is named with the counts', () => {
    expect(busiestText([load('Ama Oakhollow', 1, 3), load('Marta Veldhoen', 2, 0), load('Keiko Ferrisby', 0, 0)])).toBe(
      'the busiest is Marta Veldhoen with 2 open and 0 watching',
    );
  });

  test('when open counts tie, then the one with more watching is the busiest', () => {
    expect(busiestText([load('Marta Veldhoen', 1, 0), load('Ama Oakhollow', 1, 2)])).toBe('the busiest is Ama Oakhollow with 1 open and 2 watching');
  });

  test('when two or three share the top, then all of them are named, in the order given', () => {
    expect(busiestText([load('Marta Veldhoen', 1, 0), load('Ama Oakhollow', 1, 0)])).toBe('the busiest are Marta Veldhoen and Ama Oakhollow, with 1 open and 0 watching each');
    expect(busiestText([load('Marta Veldhoen', 1, 0), load('Ama Oakhollow', 1, 0), load('Keiko Ferrisby', 1, 0), load('Tobiah Mossgrove', 0, 1)])).toBe(
      'the busiest are Marta Veldhoen, Ama Oakhollow and Keiko Ferrisby, with 1 open and 0 watching each',
    );
  });

  test('when more than three share the top, then they are counted instead of listed', () => {
    const five = ['A', 'B', 'C', 'D', 'E'].map((n) => load(`Mentor ${n}`, 2, 1));
    expect(busiestText(five)).toBe('5 of them share the most, 2 open and 1 watching each');
  });

  test('when nobody holds an open case, or there are no mentors, then there is nothing to say', () => {
    expect(busiestText([load('Tobiah Mossgrove', 0, 2)])).toBe('');
    expect(busiestText([])).toBe('');
  });
});

describe('the strongest recovery record in words', () => {
  test('when one record leads, or two or three share the top counts, or more do, then the lead names, lists or counts them', () => {
    expect(strongestLead(['FFJ'], 'stages')).toBe('The strongest record is FFJ: ');
    expect(strongestLead(['FFJ', 'LAB'], 'stages')).toBe('The strongest records are FFJ and LAB: ');
    expect(strongestLead(['FFJ', 'LAB', 'OHN'], 'stages')).toBe('The strongest records are FFJ, LAB and OHN: ');
    expect(strongestLead(['FFJ', 'LAB', 'OHN', 'WCA', 'WCS'], 'remedies')).toBe('5 remedies share the strongest record: ');
  });
});
