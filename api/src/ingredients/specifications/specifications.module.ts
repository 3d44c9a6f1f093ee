import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AuditStoreModule } from '../../audit/audit-store.module';
import { TransactionRunner } from '../../common/transaction';
import { KitchenModule } from '../../kitchen/kitchen.module';
import { MailModule } from '../../mail/mail.module';
import { UsersModule } from '../../users/users.module';
import { IngredientStoreModule } from '../ingredient-store.module';
import { SpecificationModel } from './specification.model';
import { SpecificationReviewRunModel } from './specification-review-run.model';
import { SpecificationReviewRunsRepository } from './specification-review-runs.repository';
import { SpecificationReviewsJob } from './specification-reviews.job';
import { SpecificationsController } from './specifications.controller';
import { SpecificationsRepository } from './specifications.repository';
import { SpecificationsService } from './specifications.service';

/** Supplier specifications of ingredients (/api/ingredients/:code/specifications, /api/specifications/…); part of IngredientsModule. */
@Module({
  imports: [
    AuditStoreModule,
    IngredientStoreModule,
    KitchenModule,
    UsersModule,
    MailModule,
    SequelizeModule.forFeature([SpecificationModel, SpecificationReviewRunModel]),
  ],
  controllers: [SpecificationsController],
  providers: [
    SpecificationsService,
    SpecificationsRepository,
    SpecificationReviewRunsRepository,
    SpecificationReviewsJob,
    TransactionRunner,
  ],
  exports: [SpecificationsService],
})
export class SpecificationsModule {}
