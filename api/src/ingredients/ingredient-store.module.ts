import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { IngredientModel, IngredientRevisionModel } from './ingredient.model';
import { IngredientsRepository } from './ingredients.repository';

/**
 * The ingredients tables and their one repository. Apart from IngredientsModule (the routes)
 * because the recipe book's checked write path (BooksModule) reads every ingredient, and the
 * routes in turn write through it.
 */
@Module({
  imports: [SequelizeModule.forFeature([IngredientModel, IngredientRevisionModel])],
  providers: [IngredientsRepository],
  exports: [IngredientsRepository],
})
export class IngredientStoreModule {}
