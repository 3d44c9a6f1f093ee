import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { RecipeModel, RecipeRevisionModel } from './recipe.model';
import { RecipesRepository } from './recipes.repository';

/**
 * The recipes tables and their one repository. Apart from RecipesModule (the routes) because the
 * recipe book's checked write path (BooksModule) reads every recipe, and the routes in turn write
 * through it.
 */
@Module({
  imports: [SequelizeModule.forFeature([RecipeModel, RecipeRevisionModel])],
  providers: [RecipesRepository],
  exports: [RecipesRepository],
})
export class RecipeStoreModule {}
