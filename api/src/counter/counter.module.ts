import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { ApprovalStoreModule } from '../approvals/approval-store.module';
import { AuditStoreModule } from '../audit/audit-store.module';
import { BooksModule } from '../books/books.module';
import { TransactionRunner } from '../common/transaction';
import { DeclarationsModule } from '../declarations/declarations.module';
import { KitchenModule } from '../kitchen/kitchen.module';
import { RulesModule } from '../rules/rules.module';
import { CounterDayModel } from './counter-day.model';
import { CounterDaysRepository } from './counter-days.repository';
import { CounterChannel } from './counter-channel';
import { CounterEvents } from './counter-events';
import { CounterEventsRepository } from './counter-events.repository';
import { CounterQuestionModel } from './counter-question.model';
import { CounterQuestionsRepository } from './counter-questions.repository';
import { CounterQuestionsService } from './counter-questions.service';
import { CounterStream } from './counter-stream';
import { CounterController } from './counter.controller';
import { CounterService } from './counter.service';
import { DeclarationChanges } from './declaration-changes';

/**
 * The counter (/api/counter): every product for sale with its served declaration, the events
 * stream that tells open counter screens of changes, the products on sale each day, and the
 * questions front of house asks the kitchen.
 */
@Module({
  imports: [
    ApprovalStoreModule,
    AuditStoreModule,
    BooksModule,
    DeclarationsModule,
    KitchenModule,
    RulesModule,
    SequelizeModule.forFeature([CounterDayModel, CounterQuestionModel]),
  ],
  controllers: [CounterController],
  providers: [
    CounterService,
    CounterQuestionsService,
    CounterEvents,
    CounterChannel,
    CounterEventsRepository,
    CounterStream,
    DeclarationChanges,
    CounterDaysRepository,
    CounterQuestionsRepository,
    TransactionRunner,
  ],
})
export class CounterModule {}
