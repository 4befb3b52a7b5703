// Roles and disabled accounts. The "last active steward" rule is checked with every active
// steward's row locked, so two stewards demoting each other at the same moment cannot leave the
// community with none.
import { QueryTypes, type Transaction } from 'sequelize';
import type { Role } from '../../../shared/case-status';
import type { StewardUser, UserChangeInput } from '../../../shared/steward-schemas';
import type { AppContext } from '../../context';
import { getSequelize } from '../../db/sequelize';
import { conflict, notFound } from '../../lib/errors';
import { log } from '../../lib/logger';
import { destroyUserSessions } from '../../lib/session';
import { sessionEvents } from '../../lib/session-events';
import { audit } from '../audit/audit';
import type { UserRecord } from '../users/users.repository';

type UserRow = Pick<UserRecord, 'id' | 'email' | 'displayName' | 'role' | 'emailVerified' | 'disabled' | 'createdAt'>;

export function toStewardUser(row: UserRow): StewardUser {
  return {
    id: row.id,
    email: row.email,
    displayName: row.displayName,
    role: row.role,
    emailVerified: row.emailVerified,
    disabled: row.disabled,
    createdAt: new Date(row.createdAt).toISOString(),
  };
}

const USER_COLUMNS = `id, email, display_name AS "displayName", role, email_verified AS "emailVerified", disabled, created_at AS "createdAt"`;

/** Locks every active steward's row, then answers how many there are. */
async function lockActiveStewards(transaction: Transaction): Promise<number[]> {
  const rows = await getSequelize().query<{ id: number }>(
    `SELECT id FROM users WHERE role = 'steward' AND NOT disabled ORDER BY id FOR UPDATE`,
    { type: QueryTypes.SELECT, transaction },
  );
  return rows.map((r) => r.id);
}

async function lockUser(id: number, transaction: Transaction): Promise<UserRow | null> {
  const rows = await getSequelize().query<UserRow>(`SELECT ${USER_COLUMNS} FROM users WHERE id = :id FOR UPDATE`, {
    replacements: { id },
    type: QueryTypes.SELECT,
    transaction,
  });
  return rows[0] ?? null;
}

/**
 * Sets a user's role inside a caller's transaction (a steward's change, or an approved mentor
 * application), keeping at least one active steward. Writes the audit row; the caller logs and
 * announces after commit via `announceUserChange`.
 */
export async function setRoleInTransaction(actorId: number, userId: number, role: Role, transaction: Transaction, reason?: string): Promise<{ before: UserRow; after: UserRow } | null> {
  const stewards = await lockActiveStewards(transaction);
  const before = await lockUser(userId, transaction);
  if (!before) throw notFound('That person');
  if (before.role === role) return null;
  if (before.role === 'steward' && !before.disabled && role !== 'steward' && stewards.length <= 1) {
    throw conflict('last_steward', 'This is the last active steward. Make someone else a steward first.');
  }
  const [after] = await getSequelize().query<UserRow>(
    `UPDATE users SET role = :role, updated_at = now() WHERE id = :userId RETURNING ${USER_COLUMNS}`,
    { replacements: { role, userId }, type: QueryTypes.SELECT, transaction },
  );
  await audit(actorId, 'user.role_changed', { type: 'user', id: userId }, { from: before.role, to: role, ...(reason ? { reason } : {}) }, transaction);
  return { before, after };
}

export interface UserChangeOutcome {
  user: StewardUser;
  roleChanged: { from: Role; to: Role } | null;
  disabledChanged: boolean | null;
}

export async function changeUser(ctx: AppContext, actorId: number, userId: number, change: UserChangeInput): Promise<StewardUser> {
  const sequelize = getSequelize();
  const outcome = await sequelize.transaction(async (transaction): Promise<UserChangeOutcome> => {
    const stewards = await lockActiveStewards(transaction);
    const current = await lockUser(userId, transaction);
    if (!current) throw notFound('That person');

    const leavesStewardship =
      current.role === 'steward' && !current.disabled && ((change.role !== undefined && change.role !== 'steward') || change.disabled === true);
    if (leavesStewardship && stewards.length <= 1) {
      throw conflict(
        'last_steward',
        userId === actorId
          ? 'You are the last active steward. Make someone else a steward before you step down or disable your account.'
          : 'This is the last active steward. Make someone else a steward first.',
      );
    }

    let roleChanged: UserChangeOutcome['roleChanged'] = null;
    let latest = current;
    if (change.role !== undefined && change.role !== current.role) {
      const result = await setRoleInTransaction(actorId, userId, change.role, transaction);
      if (result) {
        roleChanged = { from: result.before.role, to: result.after.role };
        latest = result.after;
      }
    }
    let disabledChanged: boolean | null = null;
    if (change.disabled !== undefined && change.disabled !== current.disabled) {
      [latest] = await sequelize.query<UserRow>(
        `UPDATE users SET disabled = :disabled, updated_at = now() WHERE id = :userId RETURNING ${USER_COLUMNS}`,
        { replacements: { disabled: change.disabled, userId }, type: QueryTypes.SELECT, transaction },
      );
      await audit(actorId, change.disabled ? 'user.disabled' : 'user.enabled', { type: 'user', id: userId }, {}, transaction);
      disabledChanged = change.disabled;
    }
    return { user: toStewardUser(latest), roleChanged, disabledChanged };
  });

  await announceUserChange(ctx, actorId, userId, outcome);
  return outcome.user;
}

/** After commit: the security log, ended sessions for a disabled account, and the realtime layer told. */
export async function announceUserChange(ctx: AppContext, actorId: number, userId: number, outcome: Pick<UserChangeOutcome, 'roleChanged' | 'disabledChanged'>): Promise<void> {
  if (outcome.roleChanged) {
    log.security('steward.role_changed', { actorId, userId, from: outcome.roleChanged.from, to: outcome.roleChanged.to });
  }
  if (outcome.disabledChanged === true) {
    // ASVS 7.4.2: every session of the account ends now, not at its next request.
    const sids = await destroyUserSessions(ctx.sessions.pool, userId);
    log.security('steward.user_disabled', { actorId, userId, sessionsEnded: sids.length });
    for (const sid of sids) sessionEvents.emit('session:ended', sid);
    sessionEvents.emit('user:sessions-ended', userId);
  } else if (outcome.disabledChanged === false) {
    log.security('steward.user_enabled', { actorId, userId });
  }
  if (outcome.roleChanged || outcome.disabledChanged !== null) sessionEvents.emit('user:changed', userId);
}

