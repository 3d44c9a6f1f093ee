import { Column, DataType, Model, Table } from 'sequelize-typescript';
import type { MailState } from '@crumbproof/shared';

/** One mail of the outbox (migration 0010). */
@Table({ tableName: 'mail_outbox', underscored: true, timestamps: false })
export class MailOutboxModel extends Model {
  declare id: string;

  @Column({ type: DataType.STRING(40), allowNull: false })
  kind: string;

  /** The kitchen the mail is about (migration 0018); null: none in particular. */
  @Column({ type: DataType.INTEGER, allowNull: true, field: 'site_id' })
  siteId: number | null;

  @Column({ type: DataType.JSON, allowNull: false })
  recipients: string[] | string;

  @Column({ type: DataType.STRING(300), allowNull: false })
  subject: string;

  @Column({ type: DataType.TEXT('medium'), allowNull: false })
  text: string;

  @Column({ type: DataType.TEXT('medium'), allowNull: false })
  html: string;

  @Column({ type: DataType.STRING(200), allowNull: true })
  secret: string | null;

  @Column({ type: DataType.ENUM('queued', 'sent', 'failed'), allowNull: false })
  state: MailState;

  @Column({ type: DataType.INTEGER, allowNull: false })
  attempts: number;

  @Column({ type: DataType.STRING(1000), allowNull: true, field: 'last_error' })
  lastError: string | null;

  @Column({ type: DataType.DATE(3), allowNull: false, field: 'next_attempt_at' })
  nextAttemptAt: Date;

  @Column({ type: DataType.DATE(3), allowNull: true, field: 'sent_at' })
  sentAt: Date | null;

  @Column({ type: DataType.DATE(3), allowNull: false, field: 'created_at' })
  createdAt: Date;
}
