import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { DeclarationsModule } from '../declarations/declarations.module';
import { ApprovalStatus } from './approval-status';
import { ApprovalsRepository } from './approvals.repository';
import { ProductApprovalModel } from './product-approval.model';

/**
 * The approvals' table and where each product stands against it, apart from the routes' module:
 * labels (print gating, out-of-date labels) and the counter read it too.
 */
@Module({
  imports: [DeclarationsModule, SequelizeModule.forFeature([ProductApprovalModel])],
  providers: [ApprovalsRepository, ApprovalStatus],
  exports: [ApprovalsRepository, ApprovalStatus],
})
export class ApprovalStoreModule {}
