import { Column, DataType, Model, Table } from 'sequelize-typescript';

/** One print run: who printed which template for which production day, what was asked, and the PDF printed. */
@Table({ tableName: 'label_runs', underscored: true, timestamps: true, updatedAt: false })
export class LabelRunModel extends Model {
  @Column({ type: DataType.INTEGER, allowNull: false })
  siteId: number;

  /** users.id of the printer (users are deactivated, never deleted). */
  @Column({ type: DataType.INTEGER, allowNull: false })
  printedBy: number;

  @Column({ type: DataType.STRING(160), allowNull: false })
  printedByName: string;

  @Column({ type: DataType.STRING(40), allowNull: false })
  template: string;

  /** YYYY-MM-DD. */
  @Column({ type: DataType.DATEONLY, allowNull: false })
  productionDate: string;

  /** The request as the API took it. */
  @Column({ type: DataType.JSON, allowNull: false })
  request: unknown;

  /** Each item as printed: product, name, revision, basis, quantity, batch, date mark and date, SSCC range. */
  @Column({ type: DataType.JSON, allowNull: false })
  items: unknown;

  /** What each item was rendered from, in the same order: its served declaration and print details. */
  @Column({ type: DataType.JSON, allowNull: false })
  sources: unknown;

  @Column({ type: DataType.STRING(300), allowNull: true })
  overrideReason: string | null;

  /** The PDF's key in the app's FileStore (its SHA-256; migration 0014 moved the bytes there). */
  @Column({ type: DataType.CHAR(64), allowNull: false })
  storageKey: string;

  @Column({ type: DataType.INTEGER, allowNull: false })
  sizeBytes: number;

  @Column({ type: DataType.CHAR(64), allowNull: false })
  sha256: string;

  declare id: number;
  declare createdAt: Date;
}
