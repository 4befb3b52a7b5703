// Mass units a grower weighs with, and the exact factors between them. Plain data and
// functions, no zod: the case page shows weights without loading the schema library (the
// schemas are in units-schemas.ts).

export const MASS_UNITS = ['g', 'kg', 'oz', 'lb'] as const;
export type MassUnit = (typeof MASS_UNITS)[number];

export const MASS_UNIT_LABELS: Record<MassUnit, string> = {
  g: 'grams',
  kg: 'kilograms',
  oz: 'ounces',
  lb: 'pounds',
};

// International avoirdupois pound (1959 agreement): 1 lb = 0.45359237 kg exactly; 1 oz = 1/16 lb.
// Both are exact decimals, so the literals below are the definitions, not roundings.
export const GRAMS_PER_UNIT: Readonly<Record<MassUnit, number>> = {
  g: 1,
  kg: 1000,
  lb: 453.59237,
  oz: 28.349523125,
};

/** A weight as a grower types it (validated by `massSchema` in units-schemas.ts). */
export interface Mass {
  value: number;
  unit: MassUnit;
}

export function toGrams(value: number, unit: MassUnit): number {
  return value * GRAMS_PER_UNIT[unit];
}

export function fromGrams(grams: number, unit: MassUnit): number {
  return grams / GRAMS_PER_UNIT[unit];
}

export function massToGrams(mass: Mass): number {
  return toGrams(mass.value, mass.unit);
}

/** How many decimals a grower wants to read for a number of this size in this unit: a kitchen
 * scale shows whole grams, while pounds and kilograms need two places below ten. */
function decimalsFor(value: number, unit: MassUnit): number {
  const size = Math.abs(value);
  if (unit === 'g') return size < 10 ? 1 : 0;
  if (unit === 'oz') return size < 10 ? 1 : 0;
  if (size < 10) return 2;
  if (size < 100) return 1;
  return 0;
}

/** "1.98 lb", "875 g", "1,124 g", "2 kg" — trailing zeros dropped, thousands grouped. */
export function formatMass(grams: number, unit: MassUnit, locale = 'en'): string {
  const value = fromGrams(grams, unit);
  const text = new Intl.NumberFormat(locale, {
    maximumFractionDigits: decimalsFor(value, unit),
    minimumFractionDigits: 0,
  }).format(value);
  // A tiny negative rounding error should not read as "-0 g".
  return `${/^-0([.,]0*)?$/.test(text) ? '0' : text} ${unit}`;
}
