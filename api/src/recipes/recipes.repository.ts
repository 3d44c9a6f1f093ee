import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { RevisionedRepository } from '../common/revisioned.repository';
import { RecipeModel, RecipeRevisionModel, type RecipeBody } from './recipe.model';

/** The only place that reads and writes recipes and their revisions. */
@Injectable()
export class RecipesRepository extends RevisionedRepository<RecipeBody> {
  constructor(
    @InjectModel(RecipeModel) heads: typeof RecipeModel,
    @InjectModel(RecipeRevisionModel) revisions: typeof RecipeRevisionModel,
  ) {
    super(heads, revisions, 'recipeId');
  }
}
