import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { URGENCY_WEIGHTS, urgencyLevelOf, urgencyScore, type UrgencyInput } from '@shared/urgency';
import { SYMPTOM_IDS, type SymptomId } from '@shared/vocabulary';

const score = (input: Partial<UrgencyInput>) => urgencyScore({ symptoms: [], hoursWaiting: 0, ...input });

describe('urgency score', () => {
  test('when a case bubbles and smells putrid, then it outranks a dry crusty one that has waited a day', () => {
    const putrid = score({ symptoms: ['bubbling', 'smell-putrid'] });
    const crusty = score({ symptoms: ['dry-crusty'], hoursWaiting: 24 });
    expect(putrid.score).toBeGreaterThan(crusty.score);
    expect(putrid.level).toBe('high');
    expect(crusty.level).not.toBe('high');
  });

  test('when colours and smells are given, then the reasons say what was seen', () => {
    expect(score({ symptoms: ['colour-pink-red', 'smell-ammonia'] }).reasons).toEqual(['Pink or red growth (+12)', 'Ammonia smell (+10)']);
  });

  test('when nothing is wrong and nobody waited, then the score is zero and low', () => {
    expect(score({ symptoms: ['smell-earthy', 'colour-white'] })).toEqual({ score: 0, level: 'low', reasons: [] });
  });

  test('when the weights are summed by hand, then the score matches the table', () => {
    // 25 putrid + 20 free liquid + 15 high risk + 10 (2 days old) + 6 hours = 76
    const result = score({ symptoms: ['smell-putrid', 'free-liquid'], risk: 'high', batchAgeDays: 2, hoursWaiting: 6 });
    expect(result.score).toBe(76);
    expect(result.level).toBe('high');
    expect(result.reasons).toEqual([
      'Putrid or rotten smell (+25)',
      'Free liquid pooling (+20)',
      'The sugar & water check says high risk (+15)',
      'The batch is only 2 days old (+10)',
      'Waiting for a reply for 6 hours (+6)',
    ]);
  });

  test('when every bad symptom is ticked, then symptoms add no more than their cap', () => {
    const all = score({ symptoms: [...SYMPTOM_IDS] });
    expect(all.score).toBe(URGENCY_WEIGHTS.symptomCap);
    expect(all.reasons.at(-1)).toBe(`Symptoms count at most ${URGENCY_WEIGHTS.symptomCap} points together`);
  });

  test('when everything counts at its most, then the score is 100', () => {
    const most = score({ symptoms: [...SYMPTOM_IDS], risk: 'high', batchAgeDays: 0, hoursWaiting: 1000 });
    expect(most.score).toBe(100);
  });

  test('when the case waits longer, then the score rises by the hour until the cap', () => {
    const at = (hours: number) => score({ symptoms: ['wet-sloppy'], hoursWaiting: hours }).score;
    expect(at(0)).toBe(10);
    expect(at(5)).toBe(15);
    expect(at(20)).toBe(30);
    expect(at(200)).toBe(30);
  });

  test('when the sugar check says higher risk, then the score is higher', () => {
    const base = { symptoms: ['wet-sloppy'] as SymptomId[], hoursWaiting: 2 };
    expect(score({ ...base, risk: 'low' }).score).toBeLessThan(score({ ...base, risk: 'medium' }).score);
    expect(score({ ...base, risk: 'medium' }).score).toBeLessThan(score({ ...base, risk: 'high' }).score);
  });

  test('when the batch is younger, then the same trouble scores higher', () => {
    const at = (days: number | undefined) => score({ symptoms: ['free-liquid'], batchAgeDays: days }).score;
    expect(at(1)).toBe(30);
    expect(at(3)).toBe(30);
    expect(at(4)).toBe(25);
    expect(at(14)).toBe(25);
    expect(at(15)).toBe(20);
    expect(at(undefined)).toBe(20);
  });

  test('when a young plant juice bubbles, then that counts less than bubbling in a kept culture', () => {
    const fpj = score({ symptoms: ['bubbling'], stage: 'FPJ', batchAgeDays: 3 });
    const imo2 = score({ symptoms: ['bubbling'], stage: 'IMO2', batchAgeDays: 3 });
    expect(fpj.score).toBe(URGENCY_WEIGHTS.fermentingBubbling.points + 10);
    expect(imo2.score).toBe(20 + 10);
    expect(fpj.reasons).toContain('Bubbling or foaming, expected while a young FPJ ferments (+5)');
    const oldFpj = score({ symptoms: ['bubbling'], stage: 'FPJ', batchAgeDays: 30 });
    expect(oldFpj.score).toBe(20);
  });

  test('when the same symptom is listed twice, then it counts once', () => {
    expect(score({ symptoms: ['slimy', 'slimy'] }).score).toBe(20);
  });

  test('when hours or age are nonsense, then they add nothing rather than break the score', () => {
    expect(score({ symptoms: ['slimy'], hoursWaiting: Number.NaN, batchAgeDays: Number.NaN }).score).toBe(20);
    expect(score({ symptoms: ['slimy'], hoursWaiting: -5, batchAgeDays: -2 }).score).toBe(20);
  });

  test('when the levels are read, then they follow the documented thresholds', () => {
    expect(urgencyLevelOf(44)).toBe('medium');
    expect(urgencyLevelOf(45)).toBe('high');
    expect(urgencyLevelOf(20)).toBe('medium');
    expect(urgencyLevelOf(19)).toBe('low');
  });
});

describe('urgency score properties', () => {
  const symptomsArb = fc.uniqueArray(fc.constantFrom(...SYMPTOM_IDS), { maxLength: 8 });
  const riskArb = fc.constantFrom<'low' | 'medium' | 'high' | undefined>(undefined, 'low', 'medium', 'high');
  const inputArb = fc.record({
    symptoms: symptomsArb,
    risk: riskArb,
    batchAgeDays: fc.option(fc.double({ min: 0, max: 400, noNaN: true }), { nil: undefined }),
    hoursWaiting: fc.double({ min: 0, max: 500, noNaN: true }),
  });

  test('when any input is scored, then the score is a whole number from 0 to 100 with a matching level', () => {
    fc.assert(
      fc.property(inputArb, (input) => {
        const result = urgencyScore(input);
        return Number.isInteger(result.score) && result.score >= 0 && result.score <= 100 && result.level === urgencyLevelOf(result.score);
      }),
    );
  });

  test('when more hours pass, then the score never falls', () => {
    fc.assert(
      fc.property(inputArb, fc.double({ min: 0, max: 100, noNaN: true }), (input, more) => {
        return urgencyScore({ ...input, hoursWaiting: input.hoursWaiting + more }).score >= urgencyScore(input).score;
      }),
    );
  });

  test('when a symptom is added, then the score never falls', () => {
    fc.assert(
      fc.property(inputArb, fc.constantFrom(...SYMPTOM_IDS), (input, extra) => {
        return urgencyScore({ ...input, symptoms: [...input.symptoms, extra] }).score >= urgencyScore(input).score;
      }),
    );
  });
});
