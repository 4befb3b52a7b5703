import { describe, expect, test } from 'vitest';
import { DISCARD_SIGNS, SAFETY_CAUTIONS, discardNote, discardSignsIn } from '@shared/cautions';
import { SYMPTOM_IDS } from '@shared/vocabulary';

describe('safety cautions', () => {
  test.each([
    [/mask/i, 'masks'],
    [/ventilated/i, 'ventilation'],
    [/asthma.*allergies.*weak immune system/i, 'vulnerable people'],
    [/wash your hands/i, 'hand washing'],
    [/never eat or drink/i, 'not food'],
    [/children and animals/i, 'children and animals'],
    [/putrid.*black, pink or slimy.*discarded, not rescued/i, 'discard signs'],
    [/food crops.*food-safety and organic rules.*local codes.*licensed agronomist/i, 'food crops'],
    [/community members, not from licensed professionals/i, 'who gives advice'],
  ])('when the cautions are read, then they cover %s (%s)', (pattern) => {
    // PRODUCT.md, "Safety cautions to show"
    expect(SAFETY_CAUTIONS.some((c) => pattern.test(c))).toBe(true);
  });
});

describe('discard signs', () => {
  test('when the signs are listed, then they are real symptom ids', () => {
    // common practice: black, pink or slimy growth and a putrid smell mean discard
    expect([...DISCARD_SIGNS].sort()).toEqual(['colour-black', 'colour-pink-red', 'slimy', 'smell-putrid']);
    for (const sign of DISCARD_SIGNS) expect(SYMPTOM_IDS).toContain(sign);
  });

  test('when symptoms include discard signs, then exactly those are found, once each', () => {
    expect(discardSignsIn(['colour-white', 'slimy', 'smell-putrid', 'slimy'])).toEqual(['smell-putrid', 'slimy']);
    expect(discardSignsIn(['colour-white', 'smell-earthy'])).toEqual([]);
  });

  test('when there are discard signs, then the note names them and says discard', () => {
    expect(discardNote(['colour-black', 'colour-pink-red', 'slimy'])).toMatch(
      /^You noted black growth, pink or red growth and slime: discard this batch/,
    );
    expect(discardNote(['bubbling'])).toBeNull();
  });
});
