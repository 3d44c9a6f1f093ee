import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import { AppError } from '../common/app-error';
import { ChangeFeed, KeptUntilChanged } from '../database/change-feed';
import type { Role, User } from '@crumbproof/shared';
import { UserModel } from './user.model';

export interface NewUser {
  email: string;
  name: string;
  role: Role;
  /** Null: invited, no password yet. */
  passwordHash: string | null;
  /** The demo kitchen's published password (the demo seed only). */
  demoPassword?: boolean;
}

/** The only place that reads and writes the users table. */
@Injectable()
export class UsersRepository {
  /** Each account as a session check last read it (see forSession). */
  private readonly kept: KeptUntilChanged<number, UserModel | null>;

  constructor(
    @InjectModel(UserModel) private readonly users: typeof UserModel,
    private readonly feed: ChangeFeed,
  ) {
    this.kept = new KeptUntilChanged(feed, 'access');
  }

  findByEmail(email: string, transaction?: Transaction) {
    return this.users.findOne({ where: { email }, transaction });
  }

  findById(id: number, transaction?: Transaction) {
    return this.users.findByPk(id, { transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  }

  /**
   * The account a session belongs to, as the session check reads it at every request: from this
   * instance's copy while no change to accounts, sessions or roles has been heard (ChangeFeed:
   * at once on this instance, within CHANGE_STALE_MS from another), else from the database.
   */
  forSession(id: number): Promise<UserModel | null> {
    return this.kept.get(id, () => this.users.findByPk(id));
  }

  list() {
    return this.users.findAll({ order: [['name', 'ASC']] });
  }

  /** The users with these ids, by name. */
  listByIds(ids: readonly number[]) {
    if (ids.length === 0) return Promise.resolve([]);
    return this.users.findAll({ where: { id: { [Op.in]: [...ids] } }, order: [['name', 'ASC']] });
  }

  /** Refuses an email already on another account (the column is unique) as a conflict. */
  async create(user: NewUser, transaction?: Transaction) {
    try {
      return await this.users.create({ ...user }, { transaction });
    } catch (e) {
      if (e instanceof UniqueConstraintError) throw new AppError('conflict', 'A user with that email already exists.');
      throw e;
    }
  }

  async update(
    id: number,
    changes: Partial<Pick<UserModel, 'name' | 'role' | 'active' | 'passwordHash' | 'demoPassword'>>,
    transaction?: Transaction,
  ) {
    // A change to an account (its role, its state, its password) is heard by every instance's session check.
    return this.feed.accessWrite(transaction, async (t) => {
      const row = await this.users.findByPk(id, { transaction: t });
      if (!row) return null;
      return row.update(changes, { transaction: t });
    });
  }

  count() {
    return this.users.count();
  }

  /** Active users created as managers: who manages an installation before any kitchen is set up. */
  countActiveManagers(transaction?: Transaction) {
    return this.users.count({ where: { role: 'manager', active: true }, transaction });
  }

  /**
   * Active users created as managers whose password is their own (not the demo kitchen's
   * published one): who can manage an installation before any kitchen is set up.
   */
  countManagersWhoCanSignIn(transaction?: Transaction) {
    return this.users.count({ where: { role: 'manager', active: true, demoPassword: false }, transaction });
  }
}

/**
 * A user as the users list shows them: `role` is their role at the kitchen they are shown at
 * (before any kitchen, the role they were created with), `elsewhere` how many other kitchens they work in.
 */
export function toUser(row: UserModel, at?: { role: Role; elsewhere: number }): User {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: at?.role ?? row.role,
    active: row.active,
    invitationPending: row.passwordHash === null,
    createdAt: row.createdAt.toISOString(),
    elsewhere: at?.elsewhere ?? 0,
  };
}
