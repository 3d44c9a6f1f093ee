import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Role } from '@crumbproof/shared';
import { QueryTypes, type Transaction } from 'sequelize';
import type { KitchenRoleRow } from '../common/current-user.decorator';
import { KitchenRoleModel } from './kitchen-role.model';

export type { KitchenRoleRow } from '../common/current-user.decorator';

/** The only place that reads and writes kitchen_roles: who works where, and as what. */
@Injectable()
export class KitchenRolesRepository {
  constructor(@InjectModel(KitchenRoleModel) private readonly roles: typeof KitchenRoleModel) {}

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

  /** The addresses of the active people with one of these roles at the kitchen, in order (one query). */
  async activeEmailsAt(siteId: number, roles: readonly Role[], t?: Transaction): Promise<string[]> {
    if (roles.length === 0) return [];
    const rows = await this.roles.sequelize!.query<{ email: string }>(
      `SELECT u.email AS email
         FROM kitchen_roles r JOIN users u ON u.id = r.user_id
        WHERE r.site_id = :siteId AND r.role IN (:roles) AND u.active = 1 ORDER BY u.email`,
      { replacements: { siteId, roles: [...roles] }, type: QueryTypes.SELECT, transaction: t },
    );
    return rows.map((r) => r.email);
  }

  async roleAt(userId: number, siteId: number, t?: Transaction): Promise<Role | null> {
    return (await this.roles.findOne({ where: { userId, siteId }, transaction: t }))?.role ?? null;
  }

  /** Gives the person `role` at the kitchen, replacing the one they had there. */
  async set(userId: number, siteId: number, role: Role, t?: Transaction): Promise<void> {
    await this.roles.upsert({ userId, siteId, role }, { transaction: t });
  }

  async remove(userId: number, siteId: number, t?: Transaction): Promise<void> {
    await this.roles.destroy({ where: { userId, siteId }, transaction: t });
  }

  /** A new kitchen's first people: every active person already on the installation, with the role they were created with. */
  async grantEveryone(siteId: number, t?: Transaction): Promise<void> {
    await this.roles.sequelize!.query(
      'INSERT IGNORE INTO kitchen_roles (user_id, site_id, role) SELECT id, :siteId, role FROM users WHERE active = 1',
      { replacements: { siteId }, transaction: t },
    );
  }
}
