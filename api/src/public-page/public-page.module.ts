import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AuditStoreModule } from '../audit/audit-store.module';
import { BooksModule } from '../books/books.module';
import { TransactionRunner } from '../common/transaction';
import { DeclarationsModule } from '../declarations/declarations.module';
import { KitchenModule } from '../kitchen/kitchen.module';
import { RulesModule } from '../rules/rules.module';
import { PublicPageSettingsModel } from './public-page-settings.model';
import { PublicPageSettingsRepository } from './public-page-settings.repository';
import { PublicPageHitsRepository } from './public-page-hits.repository';
import { PublicPageRate } from './public-page-rate';
import { PublicPageController, PublicPageSettingsController } from './public-page.controller';
import { PublicPageService } from './public-page.service';

/**
 * The kitchen's public product page: its settings (/api/public-page/settings, manager), the page
 * of each published product (/p/:code, no sign-in) and the address a counter ticket's QR code
 * carries (PublicPageService.ticketUrls, for the labels).
 */
@Module({
  imports: [
    AuditStoreModule,
    BooksModule,
    DeclarationsModule,
    KitchenModule,
    RulesModule,
    SequelizeModule.forFeature([PublicPageSettingsModel]),
  ],
  controllers: [PublicPageSettingsController, PublicPageController],
  providers: [PublicPageService, PublicPageSettingsRepository, PublicPageHitsRepository, PublicPageRate, TransactionRunner],
  exports: [PublicPageService],
})
export class PublicPageModule {}
