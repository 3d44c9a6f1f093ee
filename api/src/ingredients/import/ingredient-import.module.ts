import { Module } from '@nestjs/common';
import { BooksModule } from '../../books/books.module';
import { RulesModule } from '../../rules/rules.module';
import { IngredientImportController } from './ingredient-import.controller';
import { IngredientImportService } from './ingredient-import.service';

@Module({
  imports: [BooksModule, RulesModule],
  controllers: [IngredientImportController],
  providers: [IngredientImportService],
})
export class IngredientImportModule {}
