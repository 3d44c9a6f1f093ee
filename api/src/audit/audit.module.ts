import { Module } from '@nestjs/common';
import { APP_INTERCEPTOR } from '@nestjs/core';
import { BooksModule } from '../books/books.module';
import { REFUSAL_LISTENER } from '../common/refusals';
import { DeclarationsModule } from '../declarations/declarations.module';
import { LabelsModule } from '../labels/labels.module';
import { AccessRefusals } from './access-refusals';
import { AuditContextInterceptor } from './audit-context.interceptor';
import { AuditStoreModule } from './audit-store.module';
import { AuditTrailService } from './audit-trail.service';
import { AuditController } from './audit.controller';
import { RecallService } from './recall.service';

/**
 * The audit trail's routes (/api/audit: search, CSV export, one event, recall from a batch code),
 * who is asking for every request (the interceptor), and refused access recorded as it is sent
 * (REFUSAL_LISTENER, told by the one exception filter). The recorder itself is AuditStoreModule's.
 */
@Module({
  imports: [AuditStoreModule, BooksModule, DeclarationsModule, LabelsModule],
  controllers: [AuditController],
  providers: [
    AuditTrailService,
    RecallService,
    AccessRefusals,
    { provide: REFUSAL_LISTENER, useExisting: AccessRefusals },
    { provide: APP_INTERCEPTOR, useClass: AuditContextInterceptor },
  ],
  exports: [REFUSAL_LISTENER],
})
export class AuditModule {}
