// The safety cautions shown wherever Sporewell talks about handling a batch (PRODUCT.md,
// "Safety cautions to show"), and the signs that mean a batch is to be thrown away.
import type { SymptomId } from './vocabulary';

export const SAFETY_CAUTIONS: readonly string[] = [
  'Mouldy cultures shed spores: wear a mask and work in a well-ventilated place.',
  'Keep cultures away from anyone with asthma, allergies or a weak immune system.',
  'Wash your hands after handling a batch.',
  'Never eat or drink a culture or anything made from it.',
  'Keep batches out of reach of children and animals.',
  'A batch that smells putrid, or grows black, pink or slimy, is to be discarded, not rescued.',
  'These are soil and plant inputs. Using them on food crops is subject to local food-safety and organic rules: follow your local codes and ask a licensed agronomist.',
  'Advice on Sporewell comes from community members, not from licensed professionals.',
];

/** Symptoms that mean discard, never rescue (common practice of the trade). */
export const DISCARD_SIGNS = ['smell-putrid', 'colour-black', 'colour-pink-red', 'slimy'] as const satisfies readonly SymptomId[];
export type DiscardSign = (typeof DISCARD_SIGNS)[number];

export const DISCARD_SIGN_WORDS: Record<DiscardSign, string> = {
  'smell-putrid': 'a putrid smell',
  'colour-black': 'black growth',
  'colour-pink-red': 'pink or red growth',
  slimy: 'slime',
};

/** The discard signs among the given symptoms, in the order of DISCARD_SIGNS, each once. */
export function discardSignsIn(symptoms: readonly string[]): DiscardSign[] {
  const present = new Set(symptoms);
  return DISCARD_SIGNS.filter((sign) => present.has(sign));
}

/** One plain sentence telling the grower to discard, naming what they saw; null when no sign. */
export function discardNote(symptoms: readonly string[]): string | null {
  const signs = discardSignsIn(symptoms);
  if (signs.length === 0) return null;
  const words = signs.map((sign) => DISCARD_SIGN_WORDS[sign]);
  const listed = words.length === 1 ? words[0] : `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
  return `You noted ${listed}: discard this batch rather than trying to rescue it. Wear a mask, throw it out sealed, wash your hands and scrub the container before you start again.`;
}
