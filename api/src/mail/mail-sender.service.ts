import { Injectable, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { SchedulerRegistry } from '@nestjs/schedule';
import type { Transporter } from 'nodemailer';
import { Clock } from '../common/clock';
import type { AppConfig } from '../config/config';
import { SiteRepository } from '../kitchen/site.repository';
import { MailOutboxRepository, type DueMail } from './mail-outbox.repository';
import { smtpTransport } from './mail-transport';

/**
 * Minutes to wait after the 1st, 2nd, 3rd and 4th failed attempt; the 5th failure leaves the
 * mail as failed (not sent) with its last error, until a manager sends it again.
 */
export const RETRY_MINUTES = [1, 5, 15, 60] as const;
export const MAX_ATTEMPTS = RETRY_MINUTES.length + 1;
/** How long a sender holds a mail it is sending before another may take it (a sender that stopped halfway). */
const LEASE_MINUTES = 5;
const BATCH = 20;
/** What stands in the kept copy for a secret the mail carried (a one-time link's token) once it is sent. */
export const SECRET_REMOVED = 'REMOVED-FROM-THE-KEPT-COPY';

/**
 * Sends the outbox through the mail server: every MAIL_POLL_SECONDS (@nestjs/schedule), and at
 * once when a mail is queued (MailService kicks it after the transaction commits). A failed
 * attempt is kept with its error and tried again after RETRY_MINUTES; nothing is dropped.
 */
@Injectable()
export class MailSender implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('Mail');
  private readonly transport: Transporter | null;
  private running: Promise<void> | null = null;
  private again = false;
  private stopped = false;

  constructor(
    private readonly outbox: MailOutboxRepository,
    private readonly sites: SiteRepository,
    private readonly config: ConfigService<AppConfig, true>,
    private readonly schedule: SchedulerRegistry,
    private readonly clock: Clock,
  ) {
    this.transport = smtpTransport({
      SMTP_HOST: config.get('SMTP_HOST', { infer: true }),
      SMTP_PORT: config.get('SMTP_PORT', { infer: true }),
      SMTP_SECURE: config.get('SMTP_SECURE', { infer: true }),
      SMTP_USER: config.get('SMTP_USER', { infer: true }),
      SMTP_PASSWORD: config.get('SMTP_PASSWORD', { infer: true }),
    });
  }

  /** Whether a mail server is set; without one, mail waits in the outbox. */
  get sending(): boolean {
    return this.transport !== null;
  }

  onApplicationBootstrap() {
    if (!this.transport) {
      this.logger.warn('No mail server is set (SMTP_HOST): mail waits in the outbox until one is.');
      return;
    }
    const every = this.config.get('MAIL_POLL_SECONDS', { infer: true }) * 1000;
    this.schedule.addInterval(
      'mail-outbox',
      setInterval(() => this.kick(), every),
    );
    this.kick();
  }

  async onApplicationShutdown() {
    this.stopped = true;
    await this.whenIdle();
    this.transport?.close();
  }

  /** Sends what is due now, or once more after the run in progress. */
  kick(): void {
    if (!this.transport || this.stopped) return;
    if (this.running) {
      this.again = true;
      return;
    }
    this.running = this.drain()
      .catch((err: unknown) => this.logger.error(`The outbox could not be read: ${err instanceof Error ? err.message : String(err)}`))
      .finally(() => {
        this.running = null;
        if (this.again) {
          this.again = false;
          this.kick();
        }
      });
  }

  /** Resolves when no send is under way (tests wait on it after a kick). */
  async whenIdle(): Promise<void> {
    while (this.running) await this.running;
  }

  private async drain() {
    for (;;) {
      const now = this.clock.now();
      const batch = await this.outbox.claimDue(now, new Date(now.getTime() + LEASE_MINUTES * 60_000), BATCH);
      if (batch.length === 0) return;
      const from = await this.from();
      for (const mail of batch) await this.sendOne(mail, from);
      if (batch.length < BATCH) return;
    }
  }

  /** "Wrenfield Lane Bakehouse via Crumbproof" <MAIL_FROM>; nodemailer quotes the name. */
  private async from() {
    const kitchen = (await this.sites.first())?.name;
    return { name: kitchen ? `${kitchen} via Crumbproof` : 'Crumbproof', address: this.config.get('MAIL_FROM', { infer: true })! };
  }

  private async sendOne(mail: DueMail, from: { name: string; address: string }) {
    const attempts = mail.attempts + 1;
    try {
      await this.transport!.sendMail({ from, to: mail.recipients, subject: mail.subject, text: mail.text, html: mail.html });
    } catch (err) {
      const error = describeSendError(err);
      const wait = RETRY_MINUTES[attempts - 1];
      const now = this.clock.now();
      await this.outbox.markAttemptFailed(
        mail.id,
        attempts,
        error,
        wait === undefined ? null : new Date(now.getTime() + wait * 60_000),
        now,
      );
      this.logger.warn(
        wait === undefined
          ? `Mail ${mail.id} was not sent after ${attempts} attempts and is kept as not sent: ${error}`
          : `Mail ${mail.id} was not sent (attempt ${attempts}), trying again in ${wait} min: ${error}`,
      );
      return;
    }
    const keep = (body: string) => (mail.secret ? body.split(mail.secret).join(SECRET_REMOVED) : body);
    await this.outbox.markSent(mail.id, attempts, this.clock.now(), { text: keep(mail.text), html: keep(mail.html) });
  }
}

/** The mail server's answer or the connection's error, in one line of at most 1000 characters. */
function describeSendError(err: unknown): string {
  const e = err as { message?: string; code?: string; responseCode?: number; response?: string };
  const parts = [e.code, e.responseCode ? String(e.responseCode) : undefined, e.response ?? e.message ?? String(err)].filter(Boolean);
  return parts.join(' ').replace(/\s+/g, ' ').slice(0, 1000);
}
