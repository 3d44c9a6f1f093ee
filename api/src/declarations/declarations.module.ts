import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { BooksModule } from '../books/books.module';
import { KitchenModule } from '../kitchen/kitchen.module';
import { SpecificationsModule } from '../ingredients/specifications/specifications.module';
import { RulesModule } from '../rules/rules.module';
import { DeclarationModel } from './declaration.model';
import { DeclarationsController } from './declarations.controller';
import { DeclarationsRepository } from './declarations.repository';
import { DeclarationsService } from './declarations.service';

/**
 * Declarations kept per recipe revision and regime, and the routes of every product's declaration
 * (/api/declarations). The route of one product's is beside the recipes (RecipesModule).
 */
@Module({
  imports: [BooksModule, KitchenModule, RulesModule, SpecificationsModule, SequelizeModule.forFeature([DeclarationModel])],
  controllers: [DeclarationsController],
  providers: [DeclarationsService, DeclarationsRepository],
  exports: [DeclarationsService],
})
export class DeclarationsModule {}
