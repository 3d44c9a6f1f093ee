import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { TransactionRunner } from '../common/transaction';
import { DeclarationModel } from '../declarations/declaration.model';
import { DeclarationsController } from '../declarations/declarations.controller';
import { DeclarationsService } from '../declarations/declarations.service';
import { IngredientModel, IngredientRevisionModel } from '../ingredients/ingredient.model';
import { IngredientsController } from '../ingredients/ingredients.controller';
import { IngredientsRepository } from '../ingredients/ingredients.repository';
import { IngredientsService } from '../ingredients/ingredients.service';
import { SiteModel } from '../kitchen/site.model';
import { RecipeModel, RecipeRevisionModel } from '../recipes/recipe.model';
import { RecipesController } from '../recipes/recipes.controller';
import { RecipesRepository } from '../recipes/recipes.repository';
import { RecipesService } from '../recipes/recipes.service';
import { RulesModule } from '../rules/rules.module';
import { UsersModule } from '../users/users.module';
import { BooksController } from './books.controller';
import { BooksService } from './books.service';

/**
 * The kitchen's data: ingredients, recipes, the recipe book and declarations. They share one
 * checked write path (BooksService), so they live in one module with a folder per feature.
 */
@Module({
  imports: [
    RulesModule,
    UsersModule,
    SequelizeModule.forFeature([SiteModel, IngredientModel, IngredientRevisionModel, RecipeModel, RecipeRevisionModel, DeclarationModel]),
  ],
  controllers: [BooksController, IngredientsController, RecipesController, DeclarationsController],
  providers: [
    BooksService,
    IngredientsRepository,
    IngredientsService,
    RecipesRepository,
    RecipesService,
    DeclarationsService,
    TransactionRunner,
  ],
  exports: [BooksService, DeclarationsService],
})
export class BooksModule {}
