// Mentor applications in and out of the database as plain objects.
import { QueryTypes, type Transaction } from 'sequelize';
import type { ApplicationStatus, MentorApplication } from '../../../shared/steward-schemas';
import type { Role } from '../../../shared/case-status';
import type { StageId } from '../../../shared/vocabulary';
import { getSequelize } from '../../db/sequelize';

interface ApplicationRow {
  id: number;
  userId: number;
  applicantName: string;
  applicantEmail: string;
  applicantRole: Role;
  applicantDisabled: boolean;
  experience: string;
  stages: StageId[];
  region: string;
  status: ApplicationStatus;
  note: string | null;
  decidedById: number | null;
  decidedByName: string | null;
  decidedAt: Date | null;
  createdAt: Date;
}

const SELECT = `
  SELECT a.id, a.user_id AS "userId", u.display_name AS "applicantName", u.email AS "applicantEmail",
         u.role AS "applicantRole", u.disabled AS "applicantDisabled",
         a.experience, a.stages, a.region, a.status, a.note,
         a.decided_by AS "decidedById", d.display_name AS "decidedByName", a.decided_at AS "decidedAt", a.created_at AS "createdAt"
    FROM mentor_applications a
    JOIN users u ON u.id = a.user_id
    LEFT JOIN users d ON d.id = a.decided_by`;

export type ApplicationRecord = MentorApplication & { applicantDisabled: boolean };

function toApplication(row: ApplicationRow): ApplicationRecord {
  return {
    id: row.id,
    applicant: { id: row.userId, displayName: row.applicantName, email: row.applicantEmail, role: row.applicantRole },
    applicantDisabled: row.applicantDisabled,
    experience: row.experience,
    stages: row.stages,
    region: row.region,
    status: row.status,
    note: row.note,
    decidedBy: row.decidedById != null ? { id: row.decidedById, displayName: row.decidedByName ?? '' } : null,
    decidedAt: row.decidedAt ? new Date(row.decidedAt).toISOString() : null,
    createdAt: new Date(row.createdAt).toISOString(),
  };
}

export function withoutInternals({ applicantDisabled: _d, ...application }: ApplicationRecord): MentorApplication {
  return application;
}

/** What a steward sees: whether the applicant's account is disabled, since that changes what they can decide. */
export function forSteward({ applicantDisabled, ...application }: ApplicationRecord): MentorApplication {
  return { ...application, applicant: { ...application.applicant, disabled: applicantDisabled } };
}

export const mentorApplicationsRepository = {
  /** Inserts a pending application; null when this person already has one pending. */
  async insertPending(input: { userId: number; experience: string; stages: StageId[]; region: string }, transaction?: Transaction): Promise<number | null> {
    const rows = await getSequelize().query<{ id: number }>(
      `INSERT INTO mentor_applications (user_id, experience, stages, region)
       VALUES (:userId, :experience, ARRAY[:stages]::text[], :region)
       ON CONFLICT (user_id) WHERE status = 'pending' DO NOTHING RETURNING id`,
      { replacements: input, type: QueryTypes.SELECT, transaction },
    );
    return rows[0]?.id ?? null;
  },

  async findById(id: number, options: { lock?: boolean; transaction?: Transaction } = {}): Promise<ApplicationRecord | null> {
    // FOR UPDATE OF a: only the application row is locked, not the people it joins.
    const rows = await getSequelize().query<ApplicationRow>(`${SELECT} WHERE a.id = :id ${options.lock ? 'FOR UPDATE OF a' : ''}`, {
      replacements: { id },
      type: QueryTypes.SELECT,
      transaction: options.transaction,
    });
    return rows[0] ? toApplication(rows[0]) : null;
  },

  async list(filter: { status?: ApplicationStatus; userId?: number; page: number; pageSize: number }): Promise<{ items: ApplicationRecord[]; total: number }> {
    const where: string[] = [];
    if (filter.status) where.push('a.status = :status');
    if (filter.userId) where.push('a.user_id = :userId');
    const whereSql = where.length ? `WHERE ${where.join(' AND ')}` : '';
    const replacements = { status: filter.status ?? null, userId: filter.userId ?? null, limit: filter.pageSize, offset: (filter.page - 1) * filter.pageSize };
    const sequelize = getSequelize();
    // Pending ones oldest first (the longest wait is answered first); decided ones newest first.
    const rows = await sequelize.query<ApplicationRow>(
      `${SELECT} ${whereSql}
        ORDER BY (a.status = 'pending') DESC,
                 CASE WHEN a.status = 'pending' THEN a.created_at END ASC,
                 COALESCE(a.decided_at, a.created_at) DESC, a.id DESC
        LIMIT :limit OFFSET :offset`,
      { replacements, type: QueryTypes.SELECT },
    );
    const [{ n }] = await sequelize.query<{ n: string }>(`SELECT count(*) AS n FROM mentor_applications a ${whereSql}`, { replacements, type: QueryTypes.SELECT });
    return { items: rows.map(toApplication), total: Number(n) };
  },

  async decide(id: number, input: { status: 'approved' | 'declined'; decidedBy: number; note: string }, transaction: Transaction): Promise<void> {
    await getSequelize().query(
      `UPDATE mentor_applications SET status = :status, decided_by = :decidedBy, decided_at = now(), note = :note WHERE id = :id`,
      { replacements: { id, ...input, note: input.note || null }, transaction },
    );
  },
};
