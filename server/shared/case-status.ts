// Case states and who may move a case between them (PRODUCT.md, "Case status"). No zod here, so
// pages that only show a status do not load the schema library: the schemas are in
// case-status-schemas.ts.

export const CASE_STATUSES = [
  'awaiting_mentor',
  'in_conversation',
  'over_to_grower',
  'watching',
  'recovered',
  'lost',
  'withdrawn',
] as const;
export type CaseStatus = (typeof CASE_STATUSES)[number];

export const STATUS_LABELS: Record<CaseStatus, string> = {
  awaiting_mentor: 'Awaiting a mentor',
  in_conversation: 'In conversation',
  over_to_grower: 'Over to the grower',
  watching: 'Watching',
  recovered: 'Recovered',
  lost: 'Lost',
  withdrawn: 'Withdrawn',
};

export const OPEN_STATUSES: readonly CaseStatus[] = ['awaiting_mentor', 'in_conversation', 'over_to_grower'];
export const RESOLVED_STATUSES: readonly CaseStatus[] = ['recovered', 'lost'];

export type Role = 'grower' | 'mentor' | 'steward';
export const ROLES = ['grower', 'mentor', 'steward'] as const;

/** Mentors and stewards: they read every case, write mentor asides and work the rounds. */
export function isStaffRole(role: Role): boolean {
  return role === 'mentor' || role === 'steward';
}

/** Who may make each move by hand with POST /status. `watching` comes from closing, and
 * `recovered`/`lost` from the recovery report; those have routes of their own. */
const MOVES: Record<CaseStatus, Partial<Record<CaseStatus, readonly Role[]>>> = {
  awaiting_mentor: { in_conversation: ['mentor', 'steward'], withdrawn: ['grower', 'steward'] },
  in_conversation: { over_to_grower: ['mentor', 'steward'], withdrawn: ['grower', 'steward'] },
  over_to_grower: { in_conversation: ['grower', 'mentor', 'steward'], withdrawn: ['grower', 'steward'] },
  watching: {},
  recovered: {},
  lost: {},
  withdrawn: {},
};

export function canMove(from: CaseStatus, to: CaseStatus, role: Role): boolean {
  return MOVES[from][to]?.includes(role) ?? false;
}

export function isLegalMove(from: CaseStatus, to: CaseStatus): boolean {
  return MOVES[from][to] !== undefined;
}
