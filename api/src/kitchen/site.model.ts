import { Column, DataType, Model, Table } from 'sequelize-typescript';
import type { Handling, MeasureSystem, Regime, Substitution } from '@crumbproof/shared';

@Table({ tableName: 'sites', underscored: true, timestamps: true })
export class SiteModel extends Model {
  /** The kitchen's id in the recipe book (migration 0016); null for the one kitchen of a book given as site. */
  @Column({ type: DataType.STRING(64), allowNull: true })
  code: string | null;

  @Column({ type: DataType.STRING(160), allowNull: false })
  name: string;

  @Column({ type: DataType.STRING(300), allowNull: false, defaultValue: '' })
  address: string;

  @Column({ type: DataType.ENUM('EU', 'UK', 'US', 'CA', 'ANZ'), allowNull: false })
  regime: Regime;

  @Column({ type: DataType.STRING(20), allowNull: true })
  measures: MeasureSystem | null;

  @Column({ type: DataType.JSON, allowNull: false })
  handles: Handling[];

  /** The kitchen's own ingredients standing in for shared ones there (migration 0016). */
  @Column({ type: DataType.JSON, allowNull: false, defaultValue: [] })
  substitutions: Substitution[];

  /** The recipes for sale that this kitchen sells; null: every one (migration 0016). */
  @Column({ type: DataType.JSON, allowNull: true })
  sells: string[] | null;

  @Column({ type: DataType.INTEGER, allowNull: false, defaultValue: 1 })
  version: number;

  /** Raised by every write under the kitchen's lock (migration 0013). */
  @Column({ type: DataType.BIGINT, allowNull: false, defaultValue: 0 })
  bookVersion: number;
}
