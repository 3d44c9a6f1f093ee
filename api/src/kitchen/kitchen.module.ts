import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AuditStoreModule } from '../audit/audit-store.module';
import { TransactionRunner } from '../common/transaction';
import { KitchenController } from './kitchen.controller';
import { KitchenService } from './kitchen.service';
import { KitchenRoleModel } from './kitchen-role.model';
import { KitchenRolesRepository } from './kitchen-roles.repository';
import { SiteModel } from './site.model';
import { SiteRepository } from './site.repository';

/** The kitchens (sites): their settings, who works at each, and the one way to get a request's kitchen (KitchenService). */
@Module({
  imports: [AuditStoreModule, SequelizeModule.forFeature([SiteModel, KitchenRoleModel])],
  controllers: [KitchenController],
  providers: [KitchenService, SiteRepository, KitchenRolesRepository, TransactionRunner],
  exports: [KitchenService, SiteRepository, KitchenRolesRepository],
})
export class KitchenModule {}
