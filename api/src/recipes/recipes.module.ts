import { Module } from '@nestjs/common';
import { BooksModule } from '../books/books.module';
import { DeclarationsModule } from '../declarations/declarations.module';
import { KitchenModule } from '../kitchen/kitchen.module';
import { UsersModule } from '../users/users.module';
import { RecipeStoreModule } from './recipe-store.module';
import { RecipesController } from './recipes.controller';
import { RecipesService } from './recipes.service';

/** Every route under /api/recipes, a product's declaration included; writes go through the book's checked write path. */
@Module({
  imports: [RecipeStoreModule, BooksModule, DeclarationsModule, KitchenModule, UsersModule],
  controllers: [RecipesController],
  providers: [RecipesService],
})
export class RecipesModule {}
