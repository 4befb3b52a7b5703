// The audit log is the system of record for what stewards (and the rules acting for them) did:
// who, what, to whom, when. Write the row in the same transaction as the change it records,
// so a change without its row (or a row without its change) cannot happen.
import { QueryTypes, type Transaction } from 'sequelize';
import type { AuditEntry } from '../../../shared/steward-schemas';
import { getSequelize } from '../../db/sequelize';

export interface AuditTarget {
  type: 'user' | 'mentor_application' | 'message' | 'report' | 'case' | (string & {});
  id: number | string;
}

/** Records one action. `detail` is kept as JSON (e.g. `{ from: 'grower', to: 'mentor' }`). */
export async function audit(
  actorId: number | null,
  action: string,
  target: AuditTarget | null,
  detail: Record<string, unknown> = {},
  transaction?: Transaction,
): Promise<number> {
  const [row] = await getSequelize().query<{ id: string }>(
    `INSERT INTO audit_log (actor_id, action, target_type, target_id, detail)
     VALUES (:actorId, :action, :targetType, :targetId, CAST(:detail AS jsonb)) RETURNING id`,
    {
      replacements: {
        actorId,
        action,
        targetType: target?.type ?? null,
        targetId: target ? String(target.id) : null,
        detail: JSON.stringify(detail),
      },
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return Number(row.id);
}

interface AuditRow {
  id: string;
  action: string;
  actorId: number | null;
  actorName: string | null;
  targetType: string | null;
  targetId: string | null;
  targetLabel: string | null;
  detail: Record<string, unknown>;
  createdAt: Date;
}

export const auditRepository = {
  async list(filter: { page: number; pageSize: number; action?: string; actorId?: number; targetType?: string; targetId?: string }): Promise<{ items: AuditEntry[]; total: number }> {
    const where: string[] = [];
    if (filter.action) where.push(`a.action = :action`);
    if (filter.actorId) where.push(`a.actor_id = :actorId`);
    if (filter.targetType) where.push(`a.target_type = :targetType`);
    if (filter.targetId) where.push(`a.target_id = :targetId`);
    const whereSql = where.length ? `WHERE ${where.join(' AND ')}` : '';
    const replacements = {
      action: filter.action ?? null,
      actorId: filter.actorId ?? null,
      targetType: filter.targetType ?? null,
      targetId: filter.targetId ?? null,
      limit: filter.pageSize,
      offset: (filter.page - 1) * filter.pageSize,
    };
    const sequelize = getSequelize();
    // Target names are looked up now rather than copied in, except where `detail` kept them.
    const rows = await sequelize.query<AuditRow>(
      `SELECT a.id, a.action, a.actor_id AS "actorId", actor.display_name AS "actorName",
              a.target_type AS "targetType", a.target_id AS "targetId", a.detail, a.created_at AS "createdAt",
              CASE a.target_type
                WHEN 'user' THEN (SELECT display_name FROM users WHERE id::text = a.target_id)
                WHEN 'mentor_application' THEN (SELECT u.display_name FROM mentor_applications ma JOIN users u ON u.id = ma.user_id WHERE ma.id::text = a.target_id)
                WHEN 'case' THEN (SELECT title FROM cases WHERE id::text = a.target_id)
                WHEN 'message' THEN (SELECT c.title FROM messages m JOIN cases c ON c.id = m.case_id WHERE m.id::text = a.target_id)
                WHEN 'report' THEN (SELECT c.title FROM message_reports r JOIN messages m ON m.id = r.message_id JOIN cases c ON c.id = m.case_id WHERE r.id::text = a.target_id)
              END AS "targetLabel"
         FROM audit_log a LEFT JOIN users actor ON actor.id = a.actor_id
         ${whereSql}
        ORDER BY a.created_at DESC, a.id DESC
        LIMIT :limit OFFSET :offset`,
      { replacements, type: QueryTypes.SELECT },
    );
    const [{ n }] = await sequelize.query<{ n: string }>(`SELECT count(*) AS n FROM audit_log a ${whereSql}`, { replacements, type: QueryTypes.SELECT });
    return {
      items: rows.map((r) => ({
        id: Number(r.id),
        action: r.action,
        actor: r.actorId != null ? { id: r.actorId, displayName: r.actorName ?? '' } : null,
        targetType: r.targetType,
        targetId: r.targetId,
        targetLabel: r.targetLabel,
        detail: r.detail ?? {},
        createdAt: new Date(r.createdAt).toISOString(),
      })),
      total: Number(n),
    };
  },
};
