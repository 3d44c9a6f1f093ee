import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { RevisionedRepository } from '../common/revisioned.repository';
import { IngredientModel, IngredientRevisionModel, type IngredientBody } from './ingredient.model';

/** The only place that reads and writes ingredients and their revisions. */
@Injectable()
export class IngredientsRepository extends RevisionedRepository<IngredientBody> {
  constructor(
    @InjectModel(IngredientModel) heads: typeof IngredientModel,
    @InjectModel(IngredientRevisionModel) revisions: typeof IngredientRevisionModel,
  ) {
    super(heads, revisions, 'ingredientId');
  }
}
