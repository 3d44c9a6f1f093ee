import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AuditStoreModule } from '../audit/audit-store.module';
import { SessionsModule } from '../auth/sessions.module';
import { KitchenModule } from '../kitchen/kitchen.module';
import { TransactionRunner } from '../common/transaction';
import { UserModel } from './user.model';
import { UsersController } from './users.controller';
import { UsersRepository } from './users.repository';
import { UsersService } from './users.service';

@Module({
  imports: [SequelizeModule.forFeature([UserModel]), SessionsModule, AuditStoreModule, KitchenModule],
  controllers: [UsersController],
  providers: [UsersService, UsersRepository, TransactionRunner],
  exports: [UsersService, UsersRepository],
})
export class UsersModule {}
