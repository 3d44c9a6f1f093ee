import { Column, DataType, Model, Table } from 'sequelize-typescript';
import type { Role } from '@crumbproof/shared';

@Table({ tableName: 'users', underscored: true, timestamps: true })
export class UserModel extends Model {
  declare id: number;

  @Column({ type: DataType.STRING(254), allowNull: false, unique: true })
  email: string;

  @Column({ type: DataType.STRING(120), allowNull: false })
  name: string;

  @Column({ type: DataType.ENUM('manager', 'pastry-chef', 'front-of-house'), allowNull: false })
  role: Role;

  /** Null for a user who was invited and has not chosen a password yet: they cannot sign in. */
  @Column({ type: DataType.STRING(100), allowNull: true, field: 'password_hash' })
  passwordHash: string | null;

  @Column({ type: DataType.BOOLEAN, allowNull: false, defaultValue: true })
  active: boolean;

  /** Still the demo kitchen's published password: such an account signs in only in demo mode. */
  @Column({ type: DataType.BOOLEAN, allowNull: false, defaultValue: false, field: 'demo_password' })
  demoPassword: boolean;

  declare createdAt: Date;
}
