// The zod schemas of a case's status and a person's role (the values are in case-status.ts).
import { z } from 'zod';
import { CASE_STATUSES, ROLES } from './case-status';

export const caseStatusSchema = z.enum(CASE_STATUSES);
export const roleSchema = z.enum(ROLES);
