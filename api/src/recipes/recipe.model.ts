import { BelongsTo, Column, DataType, ForeignKey, HasMany, Model, Table } from 'sequelize-typescript';
import type { BookRecipe } from '@crumbproof/shared';
import { SiteModel } from '../kitchen/site.model';

/** The body of a recipe revision: the recipe book's recipe without its id. */
export type RecipeBody = Omit<BookRecipe, 'id'>;

@Table({ tableName: 'recipes', underscored: true, timestamps: true })
export class RecipeModel extends Model {
  @ForeignKey(() => SiteModel)
  @Column({ type: DataType.INTEGER, allowNull: false })
  siteId: number;

  @BelongsTo(() => SiteModel)
  site: SiteModel;

  @Column({ type: DataType.STRING(80), allowNull: false })
  code: string;

  @Column({ type: DataType.STRING(160), allowNull: false })
  name: string;

  @Column({ type: DataType.INTEGER, allowNull: false, defaultValue: 1 })
  currentRevision: number;

  @Column({ type: DataType.BOOLEAN, allowNull: false, defaultValue: false })
  archived: boolean;

  @HasMany(() => RecipeRevisionModel)
  revisions: RecipeRevisionModel[];

  declare id: number;
  declare createdAt: Date;
  declare updatedAt: Date;
}

@Table({ tableName: 'recipe_revisions', underscored: true, timestamps: true, updatedAt: false })
export class RecipeRevisionModel extends Model {
  @ForeignKey(() => RecipeModel)
  @Column({ type: DataType.INTEGER, allowNull: false })
  recipeId: number;

  @BelongsTo(() => RecipeModel)
  recipe: RecipeModel;

  @Column({ type: DataType.INTEGER, allowNull: false })
  revision: number;

  @Column({ type: DataType.JSON, allowNull: false })
  body: RecipeBody;

  @Column({ type: DataType.STRING(300), allowNull: false, defaultValue: '' })
  note: string;

  @Column({ type: DataType.INTEGER, allowNull: true })
  authorId: number | null;

  declare createdAt: Date;
}
