import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AuditStoreModule } from '../../audit/audit-store.module';
import { TransactionRunner } from '../../common/transaction';
import { KitchenModule } from '../../kitchen/kitchen.module';
import { StorageModule } from '../../storage/storage.module';
import { UsersModule } from '../../users/users.module';
import { IngredientStoreModule } from '../ingredient-store.module';
import { SpecificationModel } from './specification.model';
import { SpecificationsController } from './specifications.controller';
import { SpecificationsRepository } from './specifications.repository';
import { SpecificationsService } from './specifications.service';

/**
 * Supplier specifications of ingredients (/api/ingredients/:code/specifications, /api/specifications/…);
 * part of IngredientsModule. DeclarationsModule reads from it which ingredients are overdue for review.
 */
@Module({
  imports: [
    AuditStoreModule,
    IngredientStoreModule,
    KitchenModule,
    StorageModule,
    UsersModule,
    SequelizeModule.forFeature([SpecificationModel]),
  ],
  controllers: [SpecificationsController],
  providers: [SpecificationsService, SpecificationsRepository, TransactionRunner],
  exports: [SpecificationsService],
})
export class SpecificationsModule {}
