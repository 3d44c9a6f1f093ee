import { Column, DataType, Model, PrimaryKey, Table } from 'sequelize-typescript';

/** The next SSCC serial reference of a kitchen, per GS1 company prefix and extension digit. */
@Table({ tableName: 'sscc_serials', underscored: true, timestamps: true, createdAt: false })
export class SsccSerialModel extends Model {
  @PrimaryKey
  @Column({ type: DataType.INTEGER, allowNull: false })
  siteId: number;

  @PrimaryKey
  @Column({ type: DataType.STRING(12), allowNull: false })
  companyPrefix: string;

  @PrimaryKey
  @Column({ type: DataType.TINYINT, allowNull: false })
  extension: number;

  /** BIGINT: the driver may hand it back as a string or a bigint; the repository reads it as a number. */
  @Column({ type: DataType.BIGINT, allowNull: false })
  nextSerial: number | string;
}
