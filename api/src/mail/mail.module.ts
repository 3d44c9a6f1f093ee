import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AuditStoreModule } from '../audit/audit-store.module';
import { TransactionRunner } from '../common/transaction';
import { KitchenModule } from '../kitchen/kitchen.module';
import { MailController } from './mail.controller';
import { MailOutboxModel } from './mail-outbox.model';
import { MailOutboxRepository } from './mail-outbox.repository';
import { MailSender } from './mail-sender.service';
import { MailService } from './mail.service';

/**
 * The kitchen's e-mail: the outbox (mail_outbox), its sender and the manager's Mail routes.
 * A feature that sends mail imports this module and calls MailService.enqueue in its write's
 * transaction, with a body from a template in mail/templates/.
 */
@Module({
  imports: [SequelizeModule.forFeature([MailOutboxModel]), AuditStoreModule, KitchenModule],
  controllers: [MailController],
  providers: [MailService, MailSender, MailOutboxRepository, TransactionRunner],
  exports: [MailService],
})
export class MailModule {}
