import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { IngredientModel } from '../ingredient.model';

/** One uploaded version of a supplier's specification for an ingredient. */
@Table({ tableName: 'specifications', underscored: true, timestamps: true, updatedAt: false })
export class SpecificationModel extends Model {
  @ForeignKey(() => IngredientModel)
  @Column({ type: DataType.INTEGER, allowNull: false })
  ingredientId: number;

  @BelongsTo(() => IngredientModel, { onDelete: 'CASCADE' })
  ingredient: IngredientModel;

  /** 1, 2, … per ingredient; the highest is the current specification. */
  @Column({ type: DataType.INTEGER, allowNull: false })
  version: number;

  /** The uploaded file's name, sanitised. */
  @Column({ type: DataType.STRING(200), allowNull: false })
  filename: string;

  /** The type found in the bytes, never the name or the declared type. */
  @Column({ type: DataType.STRING(100), allowNull: false })
  mediaType: string;

  @Column({ type: DataType.INTEGER, allowNull: false })
  sizeBytes: number;

  @Column({ type: DataType.CHAR(64), allowNull: false })
  sha256: string;

  /** The file's key in the app's FileStore (its SHA-256; migration 0014 moved the bytes there). */
  @Column({ type: DataType.CHAR(64), allowNull: false })
  storageKey: string;

  /** YYYY-MM-DD: when the kitchen must check the specification again. */
  @Column({ type: DataType.DATEONLY, allowNull: false })
  reviewBy: string;

  @Column({ type: DataType.STRING(500), allowNull: false, defaultValue: '' })
  note: string;

  /** The user who uploaded it (users.id; set to null when that user is deleted, by the migration's foreign key). */
  @Column({ type: DataType.INTEGER, allowNull: true })
  uploadedBy: number | null;

  declare id: number;
  declare createdAt: Date;
}
