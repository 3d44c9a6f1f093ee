import { Module } from '@nestjs/common';
import { AuditStoreModule } from '../audit/audit-store.module';
import { BooksModule } from '../books/books.module';
import { TransactionRunner } from '../common/transaction';
import { DeclarationsModule } from '../declarations/declarations.module';
import { KitchenModule } from '../kitchen/kitchen.module';
import { ApprovalStoreModule } from './approval-store.module';
import { ApprovalsController } from './approvals.controller';
import { ApprovalsService } from './approvals.service';

/** Approvals (/api/approvals): the products waiting for a manager's approval of their declaration, and approving them. */
@Module({
  imports: [ApprovalStoreModule, AuditStoreModule, BooksModule, DeclarationsModule, KitchenModule],
  controllers: [ApprovalsController],
  providers: [ApprovalsService, TransactionRunner],
  exports: [ApprovalsService],
})
export class ApprovalsModule {}
