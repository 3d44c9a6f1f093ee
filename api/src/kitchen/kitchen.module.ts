import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { KitchenController } from './kitchen.controller';
import { KitchenService } from './kitchen.service';
import { SiteModel } from './site.model';

@Module({
  imports: [SequelizeModule.forFeature([SiteModel])],
  controllers: [KitchenController],
  providers: [KitchenService],
  exports: [KitchenService],
})
export class KitchenModule {}
