/** The kitchen's outbox as the manager's Mail page reads it (GET /api/mail/outbox). */

export const MAIL_STATES = ['queued', 'sent', 'failed'] as const;
export type MailState = (typeof MAIL_STATES)[number];

/** What each state reads as. */
export const MAIL_STATE_LABELS: Record<MailState, string> = {
  queued: 'Waiting to be sent',
  sent: 'Sent',
  failed: 'Not sent',
};

/** One mail of the outbox (its body is not sent: a link it carries is for its recipient alone). */
export interface OutboxMail {
  /** The row's number (a BIGINT, sent as text). */
  id: string;
  /** invitation, password-reset, or what another feature sends. */
  kind: string;
  recipients: string[];
  subject: string;
  state: MailState;
  attempts: number;
  lastError: string | null;
  /** ISO timestamps. nextAttemptAt is when a queued mail is next tried. */
  nextAttemptAt: string | null;
  sentAt: string | null;
  createdAt: string;
}

export interface OutboxPage {
  mails: OutboxMail[];
  /** How many mails the outbox holds in all (the page shows the newest). */
  total: number;
  /** Whether a mail server is set (SMTP_HOST); without one, mails wait. */
  sending: boolean;
  /** How many attempts a mail gets before it is shown as not sent. */
  maxAttempts: number;
}
