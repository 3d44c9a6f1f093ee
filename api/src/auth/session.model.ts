import { Column, DataType, Model, Table } from 'sequelize-typescript';

/** One sign-in. The session cookie's token names its row; the row, not the token, decides whether it still works. */
@Table({ tableName: 'sessions', underscored: true, timestamps: false })
export class SessionModel extends Model {
  @Column({ type: DataType.CHAR(32), primaryKey: true })
  declare id: string;

  @Column({ type: DataType.INTEGER, allowNull: false, field: 'user_id' })
  userId: number;

  @Column({ type: DataType.DATE(3), allowNull: false, field: 'created_at' })
  createdAt: Date;

  /** When it ends unless used: moved on by each renewal, never past expiresAt. */
  @Column({ type: DataType.DATE(3), allowNull: false, field: 'idle_expires_at' })
  idleExpiresAt: Date;

  /** The absolute end, however busy the session is. */
  @Column({ type: DataType.DATE(3), allowNull: false, field: 'expires_at' })
  expiresAt: Date;

  @Column({ type: DataType.DATE(3), allowNull: true, field: 'ended_at' })
  endedAt: Date | null;

  @Column({ type: DataType.STRING(40), allowNull: true, field: 'end_reason' })
  endReason: SessionEndReason | null;
}

export type SessionEndReason = 'signed-out' | 'password-changed' | 'role-changed' | 'deactivated';
