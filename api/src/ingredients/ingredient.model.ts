import { BelongsTo, Column, DataType, ForeignKey, HasMany, Model, Table } from 'sequelize-typescript';
import type { BookIngredient } from '@crumbproof/shared';
import { SiteModel } from '../kitchen/site.model';

/** The body of an ingredient revision: the recipe book's ingredient without its id. */
export type IngredientBody = Omit<BookIngredient, 'id'>;

@Table({ tableName: 'ingredients', underscored: true, timestamps: true })
export class IngredientModel extends Model {
  @ForeignKey(() => SiteModel)
  @Column({ type: DataType.INTEGER, allowNull: false })
  siteId: number;

  @BelongsTo(() => SiteModel)
  site: SiteModel;

  /** The id used in recipe lines and the recipe book. */
  @Column({ type: DataType.STRING(80), allowNull: false })
  code: string;

  @Column({ type: DataType.STRING(160), allowNull: false })
  name: string;

  @Column({ type: DataType.INTEGER, allowNull: false, defaultValue: 1 })
  currentRevision: number;

  @Column({ type: DataType.BOOLEAN, allowNull: false, defaultValue: false })
  archived: boolean;

  @HasMany(() => IngredientRevisionModel)
  revisions: IngredientRevisionModel[];

  declare id: number;
  declare createdAt: Date;
  declare updatedAt: Date;
}

@Table({ tableName: 'ingredient_revisions', underscored: true, timestamps: true, updatedAt: false })
export class IngredientRevisionModel extends Model {
  @ForeignKey(() => IngredientModel)
  @Column({ type: DataType.INTEGER, allowNull: false })
  ingredientId: number;

  @BelongsTo(() => IngredientModel)
  ingredient: IngredientModel;

  @Column({ type: DataType.INTEGER, allowNull: false })
  revision: number;

  @Column({ type: DataType.JSON, allowNull: false })
  body: IngredientBody;

  @Column({ type: DataType.STRING(300), allowNull: false, defaultValue: '' })
  note: string;

  @Column({ type: DataType.INTEGER, allowNull: true })
  authorId: number | null;

  declare createdAt: Date;
}
