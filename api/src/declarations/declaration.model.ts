import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { RecipeModel } from '../recipes/recipe.model';

/** A computed declaration, kept per recipe revision and regime, valid while its input hash matches. */
@Table({ tableName: 'declarations', underscored: true, timestamps: true, updatedAt: false })
export class DeclarationModel extends Model {
  @ForeignKey(() => RecipeModel)
  @Column({ type: DataType.INTEGER, allowNull: false })
  recipeId: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  recipeRevision: number;

  @Column({ type: DataType.STRING(8), allowNull: false })
  regime: string;

  @Column({ type: DataType.CHAR(64), allowNull: false })
  inputHash: string;

  @Column({ type: DataType.JSON, allowNull: false })
  body: unknown;

  /** When it was computed (kept to the millisecond). */
  declare createdAt: Date;
}
