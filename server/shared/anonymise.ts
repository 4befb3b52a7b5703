// Makes free text fit for a public field note: no e-mail addresses, no long phone-like numbers,
// no names of the people on the case (replaced by their role), and none of the words or places
// the mentor flagged. Pure; the server runs it when publishing, tests run it directly.
//
// It errs on the side of leaving out: a grower called Rowan also loses the word "rowan" from
// "rowan berries". A name is matched whole-word, in any letter case, as written and without its
// accents ("Zoë" also catches "Zoe"; the reverse, accents the name does not have, is not caught).

export const GROWER_ROLE = 'the grower';
export const MENTOR_ROLE = 'the mentor';
export const LEFT_OUT = '[left out]';
export const EMAIL_LEFT_OUT = '[e-mail left out]';
export const NUMBER_LEFT_OUT = '[number left out]';

export interface AnonymiseOptions {
  /** display names of the grower side (the grower who opened the case) */
  growerNames: readonly string[];
  /** display names of the mentor side (the mentor, a steward who closed it, …) */
  mentorNames: readonly string[];
  /** words or places to leave out, e.g. where the batch sits */
  flagged?: readonly string[];
}

// Surname particles that are ordinary words on their own; the full name still goes.
const PARTICLES = new Set(['van', 'von', 'der', 'den', 'de', 'da', 'di', 'del', 'della', 'du', 'la', 'le', 'ter', 'ten', 'bin', 'al', 'el', 'mac', 'st']);

const EMAIL = /[\p{L}\p{N}._%+-]+@[\p{L}\p{N}-]+(?:\.[\p{L}\p{N}-]+)+/gu;
// Nine or more digits in a row, allowing the usual separators: phone numbers, not weights or dates.
const LONG_NUMBER = /(?<![\p{L}\p{N}])\+?\d(?:[\s().-]?\d){8,}(?![\p{L}\p{N}])/gu;

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

function stripAccents(text: string): string {
  return text.normalize('NFD').replace(/\p{M}+/gu, '').normalize('NFC');
}

function clean(text: string): string {
  return text.normalize('NFC').replace(/\s+/g, ' ').trim();
}

/** A name, its accent-free spelling, and its parts that are long enough to be a name. */
function nameVariants(name: string): string[] {
  const full = clean(name);
  if (!full) return [];
  const parts = full
    .split(/[\s\-‐–]+/u)
    .map((p) => p.replace(/^[^\p{L}\p{N}]+|[^\p{L}\p{N}]+$/gu, ''))
    .filter((p) => p.length >= 2 && !PARTICLES.has(p.toLowerCase()));
  const variants = new Set<string>([full, ...parts]);
  for (const v of [...variants]) variants.add(stripAccents(v));
  return [...variants];
}

function patternFor(terms: readonly string[]): RegExp | null {
  const unique = [...new Set(terms.map((t) => t.toLowerCase()))].filter(Boolean);
  if (unique.length === 0) return null;
  // Longest first, so "Rowan Tillsworth" goes as one before "Rowan" could match its first half.
  unique.sort((a, b) => b.length - a.length);
  const body = unique.map((t) => escapeRegExp(t).replace(/ /g, '\\s+')).join('|');
  return new RegExp(`(?<![\\p{L}\\p{N}])(?:${body})(?![\\p{L}\\p{N}])`, 'giu');
}

/** "the grower" at the start of a sentence reads "The grower". */
function fitted(replacement: string, text: string, offset: number): string {
  const before = text.slice(0, offset);
  const sentenceStart = before.trim() === '' || /[.!?:]["'”’)]*\s+$/u.test(before) || /\n\s*$/u.test(before);
  return sentenceStart ? replacement.charAt(0).toUpperCase() + replacement.slice(1) : replacement;
}

export type Anonymiser = (text: string) => string;

export function createAnonymiser(options: AnonymiseOptions): Anonymiser {
  const roleOf = new Map<string, string>();
  // The grower's names are registered last so that a name both sides share reads "the grower".
  for (const name of options.mentorNames) for (const v of nameVariants(name)) roleOf.set(v.toLowerCase(), MENTOR_ROLE);
  for (const name of options.growerNames) for (const v of nameVariants(name)) roleOf.set(v.toLowerCase(), GROWER_ROLE);
  const names = patternFor([...roleOf.keys()]);
  const flaggedTerms = (options.flagged ?? []).map(clean).filter((t) => t.length >= 2);
  const flagged = patternFor([...flaggedTerms, ...flaggedTerms.map(stripAccents)]);

  return (input: string) => {
    let text = input.normalize('NFC').replace(EMAIL, EMAIL_LEFT_OUT).replace(LONG_NUMBER, NUMBER_LEFT_OUT);
    if (flagged) text = text.replace(flagged, LEFT_OUT);
    if (names) {
      text = text.replace(names, (match: string, offset: number, whole: string) =>
        fitted(roleOf.get(match.toLowerCase().replace(/\s+/g, ' ')) ?? GROWER_ROLE, whole, offset),
      );
    }
    return text;
  };
}

export function anonymise(text: string, options: AnonymiseOptions): string {
  return createAnonymiser(options)(text);
}
