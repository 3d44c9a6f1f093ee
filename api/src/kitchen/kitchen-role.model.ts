import { Column, DataType, Model, PrimaryKey, Table } from 'sequelize-typescript';
import type { Role } from '@crumbproof/shared';

/** A person's role at one kitchen (migration 0016). */
@Table({ tableName: 'kitchen_roles', underscored: true, timestamps: true, updatedAt: false })
export class KitchenRoleModel extends Model {
  @PrimaryKey
  @Column({ type: DataType.INTEGER, allowNull: false, field: 'user_id' })
  userId: number;

  @PrimaryKey
  @Column({ type: DataType.INTEGER, allowNull: false, field: 'site_id' })
  siteId: number;

  @Column({ type: DataType.ENUM('manager', 'pastry-chef', 'front-of-house'), allowNull: false })
  role: Role;
}
