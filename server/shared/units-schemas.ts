// The zod schemas of weights (see units.ts for the units and their factors).
import { z } from 'zod';
import { MASS_UNITS, type Mass } from './units';

export const massUnitSchema = z.enum(MASS_UNITS, {
  error: 'Choose a unit: g, kg, oz or lb.',
});

const massValueSchema = z.number({ error: 'Enter a weight as a number.' });

/** A weight that must be more than nothing (a culture, a sugar you are about to add). */
export const massSchema = z.object({
  value: massValueSchema.gt(0, { error: 'Enter a weight above zero.' }),
  unit: massUnitSchema,
}) satisfies z.ZodType<Mass>;

/** A weight that may be zero (sugar not added yet, an empty container). */
export const nonNegativeMassSchema = z.object({
  value: massValueSchema.gte(0, { error: 'A weight cannot be below zero.' }),
  unit: massUnitSchema,
}) satisfies z.ZodType<Mass>;
