import { Module } from '@nestjs/common';
import { AuditStoreModule } from '../audit/audit-store.module';
import { SessionsModule } from '../auth/sessions.module';
import { TransactionRunner } from '../common/transaction';
import { KitchenModule } from '../kitchen/kitchen.module';
import { MailModule } from '../mail/mail.module';
import { UsersModule } from '../users/users.module';
import { AccountLinksRepository } from './account-links.repository';
import { AccountsController } from './accounts.controller';
import { AccountsService } from './accounts.service';

/** Accounts by mail: invitations, "Forgot your password?" and the one-time links both send (account_links). */
@Module({
  imports: [AuditStoreModule, SessionsModule, UsersModule, KitchenModule, MailModule],
  controllers: [AccountsController],
  providers: [AccountsService, AccountLinksRepository, TransactionRunner],
})
export class AccountsModule {}
