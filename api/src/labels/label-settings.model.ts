import { Column, DataType, Model, PrimaryKey, Table } from 'sequelize-typescript';

/** A kitchen's label settings: how batch codes are written and the GS1 numbers its case labels carry. */
@Table({ tableName: 'label_settings', underscored: true, timestamps: true, createdAt: false })
export class LabelSettingsModel extends Model {
  @PrimaryKey
  @Column({ type: DataType.INTEGER, allowNull: false })
  siteId: number;

  @Column({ type: DataType.STRING(60), allowNull: false })
  batchPattern: string;

  @Column({ type: DataType.STRING(12), allowNull: true })
  gs1CompanyPrefix: string | null;

  @Column({ type: DataType.TINYINT, allowNull: false })
  ssccExtension: number;

  @Column({ type: DataType.TINYINT, allowNull: false })
  caseIndicator: number;
}
