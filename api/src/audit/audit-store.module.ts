import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AuditEventModel } from './audit-event.model';
import { AuditRepository } from './audit.repository';
import { AuditService } from './audit.service';

/** The audit trail's table and its recorder: every module that writes imports this one. */
@Module({
  imports: [SequelizeModule.forFeature([AuditEventModel])],
  providers: [AuditRepository, AuditService],
  exports: [AuditRepository, AuditService],
})
export class AuditStoreModule {}
