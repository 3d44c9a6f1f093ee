import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { KitchenController } from './kitchen.controller';
import { KitchenService } from './kitchen.service';
import { SiteModel } from './site.model';
import { SiteRepository } from './site.repository';

/** The kitchen (the site): its settings, and the one way to get the current kitchen (KitchenService). */
@Module({
  imports: [SequelizeModule.forFeature([SiteModel])],
  controllers: [KitchenController],
  providers: [KitchenService, SiteRepository],
  exports: [KitchenService, SiteRepository],
})
export class KitchenModule {}
