import { Column, DataType, Model, PrimaryKey, Table } from 'sequelize-typescript';

/** A kitchen's public product page: on or off, and the address customers reach it at. */
@Table({ tableName: 'public_page_settings', underscored: true, timestamps: true, createdAt: false })
export class PublicPageSettingsModel extends Model {
  @PrimaryKey
  @Column({ type: DataType.INTEGER, allowNull: false })
  siteId: number;

  @Column({ type: DataType.BOOLEAN, allowNull: false, defaultValue: false })
  enabled: boolean;

  @Column({ type: DataType.STRING(120), allowNull: true })
  baseUrl: string | null;

  declare updatedAt: Date;
}
