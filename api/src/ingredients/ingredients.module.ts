import { Module } from '@nestjs/common';
import { BooksModule } from '../books/books.module';
import { IngredientImportModule } from './import/ingredient-import.module';
import { KitchenModule } from '../kitchen/kitchen.module';
import { UsersModule } from '../users/users.module';
import { IngredientStoreModule } from './ingredient-store.module';
import { IngredientsController } from './ingredients.controller';
import { IngredientsService } from './ingredients.service';
import { SpecificationReviewsModule } from './specifications/specification-reviews.module';
import { SpecificationsModule } from './specifications/specifications.module';

/**
 * Every route under /api/ingredients: the library (IngredientsController), supplier
 * specifications (specifications/, with /api/specifications/…) and the spreadsheet import.
 * Writes go through the book's checked write path.
 */
@Module({
  imports: [
    IngredientStoreModule,
    BooksModule,
    KitchenModule,
    UsersModule,
    SpecificationsModule,
    SpecificationReviewsModule,
    IngredientImportModule,
  ],
  controllers: [IngredientsController],
  providers: [IngredientsService],
})
export class IngredientsModule {}
