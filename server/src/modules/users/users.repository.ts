import { Op, QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize';
import type { Role } from '../../../shared/case-status';
import { UserModel } from './users.model';

export interface UserRecord {
  id: number;
  email: string;
  displayName: string;
  role: Role;
  emailVerified: boolean;
  disabled: boolean;
  about: string | null;
  notifyUrgent: boolean;
  createdAt: Date;
}

export interface UserWithHash extends UserRecord {
  passwordHash: string;
}

/** A user with its hash, from a model or from a row read with USER_WITH_HASH_COLUMNS (and nothing else it brought along). */
export function userFromRow(model: UserModel | UserWithHash): UserWithHash {
  return {
    id: model.id,
    email: model.email,
    displayName: model.displayName,
    role: model.role,
    emailVerified: model.emailVerified,
    disabled: model.disabled,
    about: model.about,
    notifyUrgent: model.notifyUrgent,
    createdAt: model.createdAt,
    passwordHash: model.passwordHash,
  };
}

/** The columns of a user with its hash, named as UserWithHash's fields, for raw SQL reads. */
export const USER_WITH_HASH_COLUMNS = `id, email::text AS email, display_name AS "displayName", role, email_verified AS "emailVerified", disabled,
  about, notify_urgent AS "notifyUrgent", created_at AS "createdAt", password_hash AS "passwordHash"`;

function withoutHash({ passwordHash: _hash, ...rest }: UserWithHash): UserRecord {
  return rest;
}

export class EmailTakenError extends Error {}

/** The mail choices kept as columns of users (a fixed list: the name goes into SQL). */
const MAIL_CHOICE_COLUMNS = { urgent: 'notify_urgent', growerWrote: 'notify_grower_wrote', mentorReplied: 'notify_mentor_replied' } as const;
export type MailChoiceColumn = keyof typeof MAIL_CHOICE_COLUMNS;

export const usersRepository = {
  async create(input: { email: string; displayName: string; passwordHash: string; role?: Role; emailVerified?: boolean }): Promise<UserRecord> {
    try {
      const created = await UserModel.create(input);
      return withoutHash(userFromRow(created));
    } catch (error) {
      if (error instanceof UniqueConstraintError) throw new EmailTakenError();
      throw error;
    }
  },

  async findById(id: number): Promise<UserRecord | null> {
    const found = await UserModel.findByPk(id);
    return found ? withoutHash(userFromRow(found)) : null;
  },

  async findByEmailWithHash(email: string): Promise<UserWithHash | null> {
    const found = await UserModel.findOne({ where: { email } });
    return found ? userFromRow(found) : null;
  },

  async update(
    id: number,
    changes: Partial<Pick<UserWithHash, 'role' | 'disabled' | 'displayName' | 'passwordHash' | 'emailVerified' | 'about' | 'notifyUrgent'>>,
    transaction?: Transaction,
  ): Promise<UserRecord | null> {
    const found = await UserModel.findByPk(id, { transaction });
    if (!found) return null;
    await found.update(changes, { transaction });
    return withoutHash(userFromRow(found));
  },

  /**
   * A person's choice about one kind of mail: `notify_urgent` (a mentor, about urgent cases nobody
   * took), `notify_grower_wrote` (a mentor, about grower posts left unread on cases they hold) or
   * `notify_mentor_replied` (a grower, about replies while they are away).
   */
  async mailChoice(id: number, column: MailChoiceColumn): Promise<boolean> {
    const [row] = await UserModel.sequelize!.query<{ on: boolean }>(`SELECT ${MAIL_CHOICE_COLUMNS[column]} AS "on" FROM users WHERE id = :id`, {
      replacements: { id },
      type: QueryTypes.SELECT,
    });
    return row?.on ?? false;
  },

  async setMailChoice(id: number, column: MailChoiceColumn, on: boolean): Promise<boolean> {
    const name = MAIL_CHOICE_COLUMNS[column];
    const [row] = await UserModel.sequelize!.query<{ on: boolean }>(`UPDATE users SET ${name} = :on WHERE id = :id RETURNING ${name} AS "on"`, {
      replacements: { id, on },
      type: QueryTypes.SELECT,
    });
    return row?.on ?? on;
  },

  async list(filter: { role?: Role; q?: string; page: number; pageSize: number }): Promise<{ items: UserRecord[]; total: number }> {
    const where: Record<string | symbol, unknown> = {};
    if (filter.role) where.role = filter.role;
    if (filter.q) {
      const like = `%${filter.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      where[Op.or] = [{ email: { [Op.iLike]: like } }, { displayName: { [Op.iLike]: like } }];
    }
    const { rows, count } = await UserModel.findAndCountAll({
      where,
      order: [['displayName', 'ASC'], ['id', 'ASC']],
      limit: filter.pageSize,
      offset: (filter.page - 1) * filter.pageSize,
    });
    return { items: rows.map((r) => withoutHash(userFromRow(r))), total: count };
  },

  async countByRole(role: Role, options: { activeOnly?: boolean } = {}): Promise<number> {
    return UserModel.count({ where: { role, ...(options.activeOnly ? { disabled: false } : {}) } });
  },
};
