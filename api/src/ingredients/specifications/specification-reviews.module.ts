import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AuditStoreModule } from '../../audit/audit-store.module';
import { TransactionRunner } from '../../common/transaction';
import { KitchenModule } from '../../kitchen/kitchen.module';
import { MailModule } from '../../mail/mail.module';
import { SpecificationReviewRunModel } from './specification-review-run.model';
import { SpecificationReviewRunsRepository } from './specification-review-runs.repository';
import { SpecificationReviewsJob } from './specification-reviews.job';
import { SpecificationsModule } from './specifications.module';

/**
 * The daily review of supplier specifications (SpecificationReviewsJob) and its record. Apart
 * from SpecificationsModule, which declarations read, so that what reads a declaration (the
 * command line's seed among them) does not load the mail and the scheduler.
 */
@Module({
  imports: [SpecificationsModule, MailModule, AuditStoreModule, KitchenModule, SequelizeModule.forFeature([SpecificationReviewRunModel])],
  providers: [SpecificationReviewsJob, SpecificationReviewRunsRepository, TransactionRunner],
})
export class SpecificationReviewsModule {}
