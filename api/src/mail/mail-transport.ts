import { createTransport, type Transporter } from 'nodemailer';
import type { AppConfig } from '../config/config';

/** Seconds to wait on a mail server before an attempt counts as failed (the sender tries again later). */
const TIMEOUT_MS = 15_000;

/** A nodemailer SMTP transport from the settings, or null when no mail server is set (SMTP_HOST). */
export function smtpTransport(
  config: Pick<AppConfig, 'SMTP_HOST' | 'SMTP_PORT' | 'SMTP_SECURE' | 'SMTP_USER' | 'SMTP_PASSWORD'>,
): Transporter | null {
  if (!config.SMTP_HOST) return null;
  return createTransport({
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    secure: config.SMTP_SECURE === 'true',
    ...(config.SMTP_USER ? { auth: { user: config.SMTP_USER, pass: config.SMTP_PASSWORD ?? '' } } : {}),
    connectionTimeout: TIMEOUT_MS,
    greetingTimeout: TIMEOUT_MS,
    socketTimeout: TIMEOUT_MS,
  });
}
