import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { anonymise, createAnonymiser, EMAIL_LEFT_OUT, LEFT_OUT, NUMBER_LEFT_OUT } from '@shared/anonymise';

const people = { growerNames: ['Rowan Tillsworth'], mentorNames: ['Marta Veldhoen'] };

describe('anonymise', () => {
  test('when the text names the grower in full, by first name or surname, in any case, then each becomes “the grower”', () => {
    expect(anonymise('I am Rowan Tillsworth. ROWAN here; tillsworth’s jar.', people)).toBe('I am the grower. The grower here; the grower’s jar.');
  });

  test('when the text names the mentor, then it reads “the mentor”, capitalised at the start of a sentence', () => {
    expect(anonymise('Marta said to skim it. Thanks, Marta!', people)).toBe('The mentor said to skim it. Thanks, the mentor!');
  });

  test('when a name is only part of a longer word, then the word stays', () => {
    expect(anonymise('Rowanberry jelly and Martabak', people)).toBe('Rowanberry jelly and Martabak');
  });

  test('when there are e-mail addresses, then they go, whatever the letters', () => {
    expect(anonymise('write to rowan.t+jars@example.test or zoë@exämple.test.', people)).toBe(`write to ${EMAIL_LEFT_OUT} or ${EMAIL_LEFT_OUT}.`);
  });

  test('when there is a phone number, then it goes, but weights, ratios and dates stay', () => {
    expect(anonymise('Call +44 7700 900123 or 07700-900-123. 900 g sugar, 1:500, made 2024-05-01, 1.2 kg.', people)).toBe(
      `Call ${NUMBER_LEFT_OUT} or ${NUMBER_LEFT_OUT}. 900 g sugar, 1:500, made 2024-05-01, 1.2 kg.`,
    );
  });

  test('when the mentor flagged a place, then it goes in any letter case and spacing', () => {
    const clean = createAnonymiser({ ...people, flagged: ['Crookback Wood', 'Fernbrook'] });
    expect(clean('Set under oaks in crookback   wood, near FERNBROOK lane.')).toBe(`Set under oaks in ${LEFT_OUT}, near ${LEFT_OUT} lane.`);
  });

  test('when a name has accents, then it is caught with and without them', () => {
    const clean = createAnonymiser({ growerNames: ['Zoë Ångström'], mentorNames: [] });
    expect(clean('Zoë and Zoe and angstrom')).toBe('The grower and the grower and the grower');
  });

  test('when a surname has particles, then the particles alone stay as ordinary words', () => {
    const clean = createAnonymiser({ growerNames: ['Pim van der Hoek'], mentorNames: [] });
    expect(clean('Pim van der Hoek left it in the van. Hoek knows.')).toBe('The grower left it in the van. The grower knows.');
  });

  test('when a name holds characters that mean something in a pattern, then they are taken literally', () => {
    const clean = createAnonymiser({ growerNames: ['J.R. (Bob)*'], mentorNames: [] });
    expect(clean('J.R. (Bob)* wrote; JXR did not.')).toBe('The grower wrote; JXR did not.');
  });

  test('when any name is put anywhere in any text, then it never comes out as a whole word (property)', () => {
    const word = fc.stringMatching(/^[A-Z][a-z]{2,9}$/);
    fc.assert(
      fc.property(word, word, fc.array(fc.constantFrom('jar', 'sour', 'the', '.', ',', 'IMO2', '\n', '900 g', '’s'), { maxLength: 20 }), (first, last, filler) => {
        const name = `${first} ${last}`;
        const text = [...filler.slice(0, 5), name, ...filler.slice(5), first.toUpperCase(), `${last}’s`].join(' ');
        const out = anonymise(text, { growerNames: [name], mentorNames: [] });
        for (const part of [first, last]) {
          expect(new RegExp(`(?<![\\p{L}\\p{N}])${part}(?![\\p{L}\\p{N}])`, 'iu').test(out)).toBe(false);
        }
      }),
      { numRuns: 300 },
    );
    // 300 generated texts take a few seconds on a loaded 2-core machine.
  }, 60_000);
});
