import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Role } from '@crumbproof/shared';
import { QueryTypes, type Transaction } from 'sequelize';
import type { KitchenRoleRow } from '../common/current-user.decorator';
import { ChangeFeed, KeptUntilChanged } from '../database/change-feed';
import { KitchenRoleModel } from './kitchen-role.model';

export type { KitchenRoleRow } from '../common/current-user.decorator';

/**
 * The only place that reads and writes kitchen_roles: who works where, and as what. Every change
 * raises the access revision in its transaction (ChangeFeed.accessWrite), so a role changed or
 * taken off applies at once on this instance and within CHANGE_STALE_MS (1 s) on every other.
 */
@Injectable()
export class KitchenRolesRepository {
  /** Each person's kitchens as the roles guard last read them (see ofUserAtRequest). */
  private readonly kept: KeptUntilChanged<number, readonly KitchenRoleRow[]>;

  constructor(
    @InjectModel(KitchenRoleModel) private readonly roles: typeof KitchenRoleModel,
    private readonly feed: ChangeFeed,
  ) {
    this.kept = new KeptUntilChanged(feed, 'access');
  }

  /**
   * ofUser as every request's roles check reads it: this instance's copy while no change to roles,
   * accounts, sessions or kitchens has been heard (ChangeFeed), else from the database.
   */
  ofUserAtRequest(userId: number): Promise<readonly KitchenRoleRow[]> {
    return this.kept.get(userId, async () => Object.freeze((await this.ofUser(userId)).map((k) => Object.freeze(k))));
  }

  /** Every kitchen the person has a role in, in the order the kitchens were set up (one query). */
  async ofUser(userId: number, t?: Transaction): Promise<KitchenRoleRow[]> {
    const sequelize = this.roles.sequelize!;
    return sequelize.query<KitchenRoleRow>(
      `SELECT r.site_id AS siteId, s.code AS code, s.name AS name, r.role AS role
         FROM kitchen_roles r JOIN sites s ON s.id = r.site_id
        WHERE r.user_id = :userId ORDER BY s.id`,
      { replacements: { userId }, type: QueryTypes.SELECT, transaction: t },
    );
  }

  /** Each person's role at one kitchen, by user id. */
  async atKitchen(siteId: number, t?: Transaction): Promise<Map<number, Role>> {
    const rows = await this.roles.findAll({ where: { siteId }, transaction: t });
    return new Map(rows.map((r) => [r.userId, r.role]));
  }

  async roleAt(userId: number, siteId: number, t?: Transaction): Promise<Role | null> {
    return (await this.roles.findOne({ where: { userId, siteId }, transaction: t }))?.role ?? null;
  }

  /** Gives the person `role` at the kitchen, replacing the one they had there. */
  async set(userId: number, siteId: number, role: Role, t?: Transaction): Promise<void> {
    await this.feed.accessWrite(t, (tx) => this.roles.upsert({ userId, siteId, role }, { transaction: tx }));
  }

  async remove(userId: number, siteId: number, t?: Transaction): Promise<void> {
    await this.feed.accessWrite(t, (tx) => this.roles.destroy({ where: { userId, siteId }, transaction: tx }));
  }

  /** How many kitchens besides `siteId` each of the people works in, by user id (none: left out). */
  async elsewhere(userIds: readonly number[], siteId: number, t?: Transaction): Promise<Map<number, number>> {
    if (userIds.length === 0) return new Map();
    const rows = await this.roles.sequelize!.query<{ userId: number; n: number | bigint }>(
      `SELECT user_id AS userId, COUNT(*) AS n FROM kitchen_roles
        WHERE user_id IN (:userIds) AND site_id <> :siteId GROUP BY user_id`,
      { replacements: { userIds: [...userIds], siteId }, type: QueryTypes.SELECT, transaction: t },
    );
    return new Map(rows.map((r) => [r.userId, Number(r.n)]));
  }

  /** The active managers of one kitchen (the people of a deactivated account do not count). */
  async countActiveManagersAt(siteId: number, t?: Transaction): Promise<number> {
    const [row] = await this.roles.sequelize!.query<{ n: number | bigint }>(
      `SELECT COUNT(*) AS n FROM kitchen_roles r JOIN users u ON u.id = r.user_id
        WHERE r.site_id = :siteId AND r.role = 'manager' AND u.active = 1`,
      { replacements: { siteId }, type: QueryTypes.SELECT, transaction: t },
    );
    return Number(row.n);
  }

  /**
   * The kitchens with no active manager whose password is their own (not the demo kitchen's
   * published one): nobody can sign in to manage them.
   */
  async kitchensWithoutManagerWhoCanSignIn(t?: Transaction): Promise<number[]> {
    const rows = await this.roles.sequelize!.query<{ id: number }>(
      `SELECT s.id AS id FROM sites s
        WHERE NOT EXISTS (SELECT 1 FROM kitchen_roles r JOIN users u ON u.id = r.user_id
                           WHERE r.site_id = s.id AND r.role = 'manager' AND u.active = 1 AND u.demo_password = 0)
        ORDER BY s.id`,
      { type: QueryTypes.SELECT, transaction: t },
    );
    return rows.map((r) => r.id);
  }

  /** The addresses of the active people with one of `roles` at any of the kitchens, each once, by address. */
  async activeEmailsWithRolesAt(siteIds: readonly number[], roles: readonly Role[], t?: Transaction): Promise<string[]> {
    if (siteIds.length === 0 || roles.length === 0) return [];
    const rows = await this.roles.sequelize!.query<{ email: string }>(
      `SELECT DISTINCT u.email AS email FROM kitchen_roles r JOIN users u ON u.id = r.user_id
        WHERE r.site_id IN (:siteIds) AND r.role IN (:roles) AND u.active = 1 ORDER BY u.email`,
      { replacements: { siteIds: [...siteIds], roles: [...roles] }, type: QueryTypes.SELECT, transaction: t },
    );
    return rows.map((r) => r.email);
  }

  /** A new kitchen's first people: every active person already on the installation, with the role they were created with. */
  async grantEveryone(siteId: number, t?: Transaction): Promise<void> {
    await this.feed.accessWrite(t, (tx) =>
      this.roles.sequelize!.query(
        'INSERT IGNORE INTO kitchen_roles (user_id, site_id, role) SELECT id, :siteId, role FROM users WHERE active = 1',
        { replacements: { siteId }, transaction: tx },
      ),
    );
  }
}
