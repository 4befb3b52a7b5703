// Who may read a case (ASVS 8.2.2, per object): its grower, any mentor, any steward. Everyone
// else gets a 404, so the existence of another grower's case is not revealed.
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../db/sequelize';
import { notFound } from '../../lib/errors';
import { log } from '../../lib/logger';
import { isStaffRole } from '../../../shared/case-status';

export interface CaseAccessRow {
  id: number;
  growerId: number;
  mentorId: number | null;
  status: string;
}

export function canReadCase(user: Pick<Express.User, 'id' | 'role'> | undefined, row: CaseAccessRow): boolean {
  if (!user) return false;
  if (isStaffRole(user.role)) return true;
  return row.growerId === user.id;
}

/** Mentors see asides; growers never do. */
export function seesAsides(user: Pick<Express.User, 'role'>): boolean {
  return isStaffRole(user.role);
}

export async function findCaseForAccess(caseId: number): Promise<CaseAccessRow | null> {
  const rows = await getSequelize().query<CaseAccessRow>(
    `SELECT id, grower_id AS "growerId", mentor_id AS "mentorId", status FROM cases WHERE id = :caseId`,
    { replacements: { caseId }, type: QueryTypes.SELECT },
  );
  return rows[0] ?? null;
}

export async function readableCaseOr404(user: Express.User | undefined, caseId: number): Promise<CaseAccessRow> {
  const row = await findCaseForAccess(caseId);
  if (!row) throw notFound('That case');
  if (!canReadCase(user, row)) {
    // The answer is the same 404 as for a missing case, but this is a refused access, not a
    // typo: the error handler logs only 401/403, so it is logged here (ASVS 16.3.2).
    log.security('case.access_refused', { userId: user?.id ?? null, caseId });
    throw notFound('That case');
  }
  return row;
}
