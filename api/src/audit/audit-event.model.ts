import { Column, DataType, Model, Table } from 'sequelize-typescript';

/** A row of the audit trail (append-only: see migration 0009). */
@Table({ tableName: 'audit_events', underscored: true, timestamps: false })
export class AuditEventModel extends Model {
  @Column({ type: DataType.BIGINT, primaryKey: true, autoIncrement: true })
  declare id: string;

  @Column({ type: DataType.DATE(3), allowNull: false })
  at: Date;

  @Column({ type: DataType.INTEGER, allowNull: true })
  actorId: number | null;

  @Column({ type: DataType.STRING(160), allowNull: true })
  actorName: string | null;

  @Column({ type: DataType.STRING(20), allowNull: true })
  actorRole: string | null;

  @Column({ type: DataType.STRING(40), allowNull: false })
  action: string;

  @Column({ type: DataType.STRING(40), allowNull: true })
  recordKind: string | null;

  @Column({ type: DataType.STRING(120), allowNull: true })
  recordId: string | null;

  @Column({ type: DataType.STRING(1000), allowNull: false })
  summary: string;

  @Column({ type: DataType.JSON, allowNull: true })
  before: unknown;

  @Column({ type: DataType.JSON, allowNull: true })
  after: unknown;

  @Column({ type: DataType.STRING(64), allowNull: true })
  address: string | null;

  /** The kitchen the event was recorded at; null: none in particular (migration 0017). */
  @Column({ type: DataType.INTEGER, allowNull: true })
  siteId: number | null;
}
