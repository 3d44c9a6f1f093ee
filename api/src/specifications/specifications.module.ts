import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { BooksModule } from '../books/books.module';
import { TransactionRunner } from '../common/transaction';
import { IngredientModel } from '../ingredients/ingredient.model';
import { UserModel } from '../users/user.model';
import { SpecificationModel } from './specification.model';
import { SpecificationsController } from './specifications.controller';
import { SpecificationsRepository } from './specifications.repository';
import { SpecificationsService } from './specifications.service';

@Module({
  imports: [BooksModule, SequelizeModule.forFeature([SpecificationModel, IngredientModel, UserModel])],
  controllers: [SpecificationsController],
  providers: [SpecificationsService, SpecificationsRepository, TransactionRunner],
})
export class SpecificationsModule {}
