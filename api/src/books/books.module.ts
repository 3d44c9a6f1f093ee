import { Module } from '@nestjs/common';
import { AuditStoreModule } from '../audit/audit-store.module';
import { TransactionRunner } from '../common/transaction';
import { IngredientStoreModule } from '../ingredients/ingredient-store.module';
import { KitchenModule } from '../kitchen/kitchen.module';
import { RecipeStoreModule } from '../recipes/recipe-store.module';
import { RulesModule } from '../rules/rules.module';
import { UsersModule } from '../users/users.module';
import { BooksController } from './books.controller';
import { BooksService } from './books.service';

/**
 * The kitchen as one recipe book (export and import, /api/book) and the one checked write path
 * every change to ingredients and recipes goes through (BooksService). It reads and writes the
 * ingredients and recipes through their repositories; their routes are in IngredientsModule and
 * RecipesModule, which write through this one.
 */
@Module({
  imports: [AuditStoreModule, KitchenModule, IngredientStoreModule, RecipeStoreModule, RulesModule, UsersModule],
  controllers: [BooksController],
  providers: [BooksService, TransactionRunner],
  exports: [BooksService],
})
export class BooksModule {}
