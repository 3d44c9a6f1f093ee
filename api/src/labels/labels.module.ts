import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { ApprovalStoreModule } from '../approvals/approval-store.module';
import { AuditStoreModule } from '../audit/audit-store.module';
import { BooksModule } from '../books/books.module';
import { TransactionRunner } from '../common/transaction';
import { DeclarationsModule } from '../declarations/declarations.module';
import { KitchenModule } from '../kitchen/kitchen.module';
import { PublicPageModule } from '../public-page/public-page.module';
import { RulesModule } from '../rules/rules.module';
import { StorageModule } from '../storage/storage.module';
import { LabelBatchModel } from './label-batch.model';
import { LabelCountersRepository } from './label-counters.repository';
import { LabelPrinter } from './label-printer';
import { LabelRunItemModel } from './label-run-item.model';
import { LabelRunModel } from './label-run.model';
import { LabelRunsRepository } from './label-runs.repository';
import { LabelSettingsModel } from './label-settings.model';
import { LabelStaleHandledModel } from './label-stale-handled.model';
import { LabelStaleRepository } from './label-stale.repository';
import { LabelSettingsRepository } from './label-settings.repository';
import { LabelsController } from './labels.controller';
import { LabelsService } from './labels.service';
import { SsccSerialModel } from './sscc-serial.model';
import { StaleLabelsService } from './stale-labels.service';

/**
 * Labels (/api/labels): the templates, the kitchen's label settings, print runs rendered from each
 * product's kept declaration, and the print log with every run's PDF. The label settings are
 * exported for the demo seed.
 */
@Module({
  imports: [
    ApprovalStoreModule,
    AuditStoreModule,
    BooksModule,
    DeclarationsModule,
    KitchenModule,
    PublicPageModule,
    RulesModule,
    StorageModule,
    SequelizeModule.forFeature([
      LabelSettingsModel,
      LabelRunModel,
      LabelRunItemModel,
      LabelBatchModel,
      SsccSerialModel,
      LabelStaleHandledModel,
    ]),
  ],
  controllers: [LabelsController],
  providers: [
    LabelsService,
    StaleLabelsService,
    LabelStaleRepository,
    LabelPrinter,
    LabelSettingsRepository,
    LabelRunsRepository,
    LabelCountersRepository,
    TransactionRunner,
  ],
  exports: [LabelSettingsRepository, LabelRunsRepository],
})
export class LabelsModule {}
