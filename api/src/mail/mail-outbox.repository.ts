import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { literal, Op, type Transaction, type WhereOptions } from 'sequelize';
import type { OutboxMail } from '@crumbproof/shared';
import { parseJson } from '../common/json-column';
import { MailOutboxModel } from './mail-outbox.model';

export interface NewMail {
  kind: string;
  /** The kitchen it is about; null: none in particular. */
  siteId: number | null;
  recipients: string[];
  subject: string;
  text: string;
  html: string;
  secret: string | null;
  createdAt: Date;
}

/** A mail as the sender reads it. */
export interface DueMail {
  id: string;
  recipients: string[];
  subject: string;
  text: string;
  html: string;
  secret: string | null;
  attempts: number;
}

/** The only place that reads and writes mail_outbox. */
@Injectable()
export class MailOutboxRepository {
  constructor(@InjectModel(MailOutboxModel) private readonly mails: typeof MailOutboxModel) {}

  async add(mail: NewMail, transaction?: Transaction): Promise<string> {
    const row = await this.mails.create(
      { ...mail, state: 'queued', attempts: 0, lastError: null, nextAttemptAt: mail.createdAt, sentAt: null },
      { transaction },
    );
    return String(row.id);
  }

  /**
   * Takes up to `limit` queued mails that are due at `now` for this sender: each is leased until
   * `leaseUntil` by moving its next attempt there in one guarded update, so two senders (two
   * instances of the API) never send the same mail, and a sender that stops halfway leaves it to
   * be tried again when the lease runs out.
   */
  async claimDue(now: Date, leaseUntil: Date, limit: number): Promise<DueMail[]> {
    const due = await this.mails.findAll({
      where: { state: 'queued', nextAttemptAt: { [Op.lte]: now } },
      order: [
        ['nextAttemptAt', 'ASC'],
        ['id', 'ASC'],
      ],
      limit,
    });
    const claimed: DueMail[] = [];
    for (const row of due) {
      const [count] = await this.mails.update(
        { nextAttemptAt: leaseUntil },
        { where: { id: row.id, state: 'queued', nextAttemptAt: row.nextAttemptAt } },
      );
      if (count === 1) {
        claimed.push({
          id: String(row.id),
          recipients: parseJson(row.recipients),
          subject: row.subject,
          text: row.text,
          html: row.html,
          secret: row.secret,
          attempts: row.attempts,
        });
      }
    }
    return claimed;
  }

  /** Sent: the body keeps no secret it carried. */
  async markSent(id: string, attempts: number, at: Date, body: { text: string; html: string }) {
    await this.mails.update({ state: 'sent', sentAt: at, attempts, lastError: null, ...body, secret: null }, { where: { id } });
  }

  /** A failed attempt: tried again at `nextAttemptAt`, or failed for good when that is null. */
  async markAttemptFailed(id: string, attempts: number, error: string, nextAttemptAt: Date | null, now: Date) {
    await this.mails.update(
      nextAttemptAt ? { attempts, lastError: error, nextAttemptAt } : { attempts, lastError: error, state: 'failed', nextAttemptAt: now },
      { where: { id } },
    );
  }

  /** The newest mails first of the kitchen's outbox (see `ofKitchen`). */
  async page(siteId: number | null, limit: number, offset: number): Promise<{ mails: OutboxMail[]; total: number }> {
    const { rows, count } = await this.mails.findAndCountAll({ where: this.ofKitchen(siteId), order: [['id', 'DESC']], limit, offset });
    return { mails: rows.map(toOutboxMail), total: count };
  }

  /** A mail of the kitchen's outbox, locked for the transaction; null when there is none (or it is another kitchen's). */
  async findForUpdate(id: string, siteId: number | null, transaction: Transaction): Promise<OutboxMail | null> {
    const row = await this.mails.findOne({
      where: { [Op.and]: [{ id }, this.ofKitchen(siteId)] },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    return row ? toOutboxMail(row) : null;
  }

  /**
   * A kitchen's outbox: the mails about it, and those about no kitchen in particular (a password
   * reset) that are to someone with a role there, or to nobody with a role anywhere (a person since
   * taken off every kitchen), so that no kitchen's managers read another kitchen's mail. Before any
   * kitchen is set up (null), every mail.
   */
  private ofKitchen(siteId: number | null): WhereOptions {
    // No kitchen set up yet: no mail can be about one.
    if (siteId === null) return {};
    // Over the recipients' roles: none at all gives NULL (shown), any at this kitchen 1 (shown).
    const here = `(SELECT MAX(kr.site_id = ${this.mails.sequelize!.escape(siteId)}) FROM kitchen_roles kr JOIN users u ON u.id = kr.user_id WHERE JSON_CONTAINS(recipients, JSON_QUOTE(u.email)))`;
    return { [Op.or]: [{ siteId }, { [Op.and]: [{ siteId: null }, literal(`COALESCE(${here}, 1) = 1`)] }] };
  }

  /** A failed mail is queued again with its attempts from nought (its last error is kept until the next attempt). */
  async requeue(id: string, now: Date, transaction: Transaction) {
    await this.mails.update({ state: 'queued', attempts: 0, nextAttemptAt: now }, { where: { id, state: 'failed' }, transaction });
  }
}

function toOutboxMail(row: MailOutboxModel): OutboxMail {
  return {
    id: String(row.id),
    kind: row.kind,
    recipients: parseJson(row.recipients),
    subject: row.subject,
    state: row.state,
    attempts: row.attempts,
    lastError: row.lastError,
    nextAttemptAt: row.state === 'queued' ? row.nextAttemptAt.toISOString() : null,
    sentAt: row.sentAt ? row.sentAt.toISOString() : null,
    createdAt: row.createdAt.toISOString(),
  };
}
