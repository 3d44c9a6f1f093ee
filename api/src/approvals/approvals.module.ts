import { Module } from '@nestjs/common';
import { AuditStoreModule } from '../audit/audit-store.module';
import { BooksModule } from '../books/books.module';
import { TransactionRunner } from '../common/transaction';
import { DeclarationsModule } from '../declarations/declarations.module';
import { KitchenModule } from '../kitchen/kitchen.module';
import { MailModule } from '../mail/mail.module';
import { ApprovalMails } from './approval-mails';
import { ApprovalStoreModule } from './approval-store.module';
import { ApprovalsController } from './approvals.controller';
import { ApprovalsService } from './approvals.service';

/**
 * Approvals (/api/approvals): the products waiting for a manager's approval of their declaration,
 * approving them, and the mail of both (ApprovalMails).
 */
@Module({
  imports: [ApprovalStoreModule, AuditStoreModule, BooksModule, DeclarationsModule, KitchenModule, MailModule],
  controllers: [ApprovalsController],
  providers: [ApprovalsService, ApprovalMails, TransactionRunner],
  exports: [ApprovalsService],
})
export class ApprovalsModule {}
