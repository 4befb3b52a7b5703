// The vocabulary's ids as zod schemas, kept apart from the lists themselves (vocabulary.ts) so
// that showing a label never loads zod.
import { z } from 'zod';
import { CAUSE_IDS, REMEDY_IDS, STAGE_IDS, SYMPTOM_IDS } from './vocabulary';

export const stageSchema = z.enum(STAGE_IDS);
export const symptomSchema = z.enum(SYMPTOM_IDS);
export const causeSchema = z.enum(CAUSE_IDS);
export const remedySchema = z.enum(REMEDY_IDS);
