import { Injectable } from '@nestjs/common';
import type { Transaction } from 'sequelize';
import { emailSchema, type OutboxMail, type OutboxPage, type Role } from '@crumbproof/shared';
import { AuditService } from '../audit/audit.service';
import { AppError } from '../common/app-error';
import { Clock } from '../common/clock';
import { TransactionRunner } from '../common/transaction';
import { KitchenRolesRepository } from '../kitchen/kitchen-roles.repository';
import { KitchenService } from '../kitchen/kitchen.service';
import { MailOutboxRepository } from './mail-outbox.repository';
import { MAX_ATTEMPTS, MailSender } from './mail-sender.service';

/** A mail to queue: what kind it is (invitation, password-reset, approval-requested…), to whom, and its rendered body. */
export interface OutgoingMail {
  kind: string;
  /** The kitchen it is about (whose managers see it in their outbox); null: none in particular, as a password reset. */
  kitchenId: number | null;
  to: string[];
  subject: string;
  text: string;
  html: string;
}

const KIND = /^[a-z][a-z0-9-]{0,39}$/;
const OUTBOX_PAGE = 200;

/**
 * The kitchen's e-mail. Features queue a mail with `enqueue` inside the transaction of the write
 * it tells of, so it is kept with that write or not at all; the sender sends it once the
 * transaction commits (and tries again later when the mail server fails). Templates live in
 * `mail/templates/` as plain functions returning { subject, text, html }.
 */
@Injectable()
export class MailService {
  constructor(
    private readonly outbox: MailOutboxRepository,
    private readonly sender: MailSender,
    private readonly kitchenRoles: KitchenRolesRepository,
    private readonly kitchen: KitchenService,
    private readonly tx: TransactionRunner,
    private readonly audit: AuditService,
    private readonly clock: Clock,
  ) {}

  /**
   * Queues a mail in the caller's transaction `t` (or on its own without one) and has it sent as
   * soon as that transaction commits; a rolled-back write leaves no mail. Returns the outbox id.
   * Throws when the mail is malformed (no recipient, an address that is not one, an unknown kind).
   */
  enqueue(mail: OutgoingMail, t?: Transaction): Promise<string> {
    return this.add(mail, null, t);
  }

  /**
   * As `enqueue`, for a mail that carries something for its recipient alone (a one-time link's
   * token): it is taken out of the kept copy once the mail is sent.
   */
  enqueueWithSecret(mail: OutgoingMail, secret: string, t?: Transaction): Promise<string> {
    return this.add(mail, secret, t);
  }

  /**
   * The addresses of the active people who have one of `roles` at the kitchen (or any of the
   * kitchens) named: whom to tell of a change there, each once, in one order.
   */
  async addressesOf(roles: readonly Role[], at: number | readonly number[], t?: Transaction): Promise<string[]> {
    return this.kitchenRoles.activeEmailsWithRolesAt(typeof at === 'number' ? [at] : at, roles, t);
  }

  /** The newest mails of the request's kitchen's outbox (GET /api/mail/outbox). */
  async page(): Promise<OutboxPage> {
    // Before any kitchen is set up every mail is about none in particular: the whole outbox.
    const site = await this.kitchen.find();
    const { mails, total } = await this.outbox.page(site?.id ?? null, OUTBOX_PAGE, 0);
    return { mails, total, sending: this.sender.sending, maxAttempts: MAX_ATTEMPTS };
  }

  /** A mail that was not sent is queued again now, with its attempts from nought (the manager's Send again). */
  async retry(id: string): Promise<OutboxMail> {
    if (!/^\d{1,19}$/.test(id)) throw new AppError('not-found', `There is no mail ${id.slice(0, 40)}.`);
    const site = await this.kitchen.find();
    const mail = await this.tx.run(async (t) => {
      const before = await this.outbox.findForUpdate(id, site?.id ?? null, t);
      if (!before) throw new AppError('not-found', `There is no mail ${id}.`);
      if (before.state !== 'failed') {
        throw new AppError(
          'conflict',
          before.state === 'sent'
            ? 'This mail was sent already.'
            : 'This mail is waiting to be sent already; it is tried again on its own.',
        );
      }
      await this.outbox.requeue(id, this.clock.now(), t);
      const after = (await this.outbox.findForUpdate(id, site?.id ?? null, t))!;
      await this.audit.record(
        {
          action: 'mail.retried',
          record: { kind: 'mail', id },
          summary: `Sent again the mail “${before.subject}” to ${before.recipients.join(', ')} after ${before.attempts} failed attempts (${before.lastError ?? 'no error kept'}).`,
          before: { state: before.state, attempts: before.attempts, lastError: before.lastError },
          after: { state: after.state, attempts: after.attempts },
        },
        t,
      );
      t.afterCommit(() => this.sender.kick());
      return after;
    });
    return mail;
  }

  private async add(mail: OutgoingMail, secret: string | null, t?: Transaction): Promise<string> {
    if (!KIND.test(mail.kind)) throw new Error(`A mail's kind is lower-case words with hyphens: ${JSON.stringify(mail.kind)}.`);
    const recipients = [...new Set(mail.to.map((a) => emailSchema.parse(a)))];
    if (recipients.length === 0) throw new Error(`A ${mail.kind} mail needs at least one recipient.`);
    if (!mail.subject.trim() || !mail.text.trim() || !mail.html.trim())
      throw new Error(`A ${mail.kind} mail needs a subject, text and HTML.`);
    const id = await this.outbox.add(
      {
        kind: mail.kind,
        siteId: mail.kitchenId,
        recipients,
        subject: mail.subject.replace(/\s+/g, ' ').trim().slice(0, 300),
        text: mail.text,
        html: mail.html,
        secret,
        createdAt: this.clock.now(),
      },
      t,
    );
    if (t) t.afterCommit(() => this.sender.kick());
    else this.sender.kick();
    return id;
  }
}
