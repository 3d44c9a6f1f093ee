import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AuditStoreModule } from '../audit/audit-store.module';
import { TransactionRunner } from '../common/transaction';
import { KitchenController } from './kitchen.controller';
import { KitchenService } from './kitchen.service';
import { SiteModel } from './site.model';
import { SiteRepository } from './site.repository';

/** The kitchen (the site): its settings, and the one way to get the current kitchen (KitchenService). */
@Module({
  imports: [AuditStoreModule, SequelizeModule.forFeature([SiteModel])],
  controllers: [KitchenController],
  providers: [KitchenService, SiteRepository, TransactionRunner],
  exports: [KitchenService, SiteRepository],
})
export class KitchenModule {}
