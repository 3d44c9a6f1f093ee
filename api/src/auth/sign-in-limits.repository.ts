import { Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { AppError } from '../common/app-error';
import type { AppConfig } from '../config/config';

/** Wrong passwords in a row an email may have before it must wait. */
export const FREE_TRIES = 4;
/** From this many wrong passwords in a row, the email is locked for LOCK_MINUTES at a time. */
export const LOCK_AT = 10;
export const LOCK_MINUTES = 60;
/** Wrong passwords older than this are forgotten. */
const FORGET_AFTER_MS = 24 * 60 * 60 * 1000;

/** How long an email waits after its n-th wrong password in a row: none, then 1, 2, 4, 8, 16 minutes, then locked. */
export function waitAfterFailures(n: number): number {
  if (n <= FREE_TRIES) return 0;
  if (n >= LOCK_AT) return LOCK_MINUTES * 60_000;
  return 2 ** (n - FREE_TRIES - 1) * 60_000;
}

export interface Attempt {
  email: string;
  scopes: string[];
  windowStart: Date;
}

/** InnoDB ends one of two transactions waiting on each other (1213) or a wait too long (1205); trying again is the cure. */
async function retryingDeadlocks<T>(work: () => Promise<T>): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await work();
    } catch (err) {
      const errno = (err as { original?: { errno?: number }; parent?: { errno?: number } }).original?.errno;
      if (attempt >= 5 || !(errno === 1213 || errno === 1205 || err instanceof RowGone)) throw err;
    }
  }
}

/** The email's row was removed between making sure it exists and locking it. */
class RowGone extends Error {}

const minutes = (ms: number) => {
  const m = Math.max(1, Math.ceil(ms / 60_000));
  return `${m} minute${m === 1 ? '' : 's'}`;
};

/**
 * Slows password guessing, with every count in the database so that all instances of the API
 * share it: per email (a back-off, then a lockout), per address, and across the whole kitchen
 * (so one password tried against many accounts is slowed too). An attempt counts as a failure
 * from the moment it starts, so guesses sent in parallel cannot slip past; a right password
 * takes its count back.
 */
@Injectable()
export class SignInLimits {
  constructor(
    private readonly sequelize: Sequelize,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  private get windowMs() {
    return this.config.get('SIGN_IN_WINDOW_SECONDS', { infer: true }) * 1000;
  }

  /** Refuses with a plain message when the kitchen, this address or this email must wait; otherwise counts the attempt. */
  async begin(email: string, address: string, now = new Date()): Promise<Attempt> {
    const windowStart = new Date(Math.floor(now.getTime() / this.windowMs) * this.windowMs);
    const scopes = ['kitchen', `address:${address}`.slice(0, 80)];
    await retryingDeadlocks(() => this.countWindow(scopes, windowStart, +1));
    const counts = await this.sequelize.query<{ scope: string; failures: number }>(
      'SELECT scope, failures FROM sign_in_counters WHERE window_start = ? AND scope IN (?)',
      { replacements: [windowStart, scopes], type: QueryTypes.SELECT },
    );
    const count = (scope: string) => Number(counts.find((c) => c.scope === scope)?.failures ?? 0);
    const waitMs = windowStart.getTime() + this.windowMs - now.getTime();
    if (count('kitchen') > this.config.get('SIGN_IN_GLOBAL_LIMIT', { infer: true })) {
      await retryingDeadlocks(() => this.countWindow(scopes, windowStart, -1));
      throw new AppError(
        'too-many-requests',
        `Too many wrong passwords on this kitchen's accounts in the last minutes. Everyone waits ${minutes(waitMs)}, then signs in again.`,
      );
    }
    if (count(scopes[1]) > this.config.get('SIGN_IN_LIMIT', { infer: true })) {
      await retryingDeadlocks(() => this.countWindow(scopes, windowStart, -1));
      throw new AppError('too-many-requests', `Too many wrong passwords from this device. Wait ${minutes(waitMs)}, then try again.`);
    }
    try {
      await retryingDeadlocks(() => this.countEmail(email, now));
    } catch (err) {
      await retryingDeadlocks(() => this.countWindow(scopes, windowStart, -1));
      throw err;
    }
    return { email, scopes, windowStart };
  }

  /**
   * Counts a "Forgot your password?" request against the same limits as sign-in, per address
   * (SIGN_IN_LIMIT) and across the kitchen (SIGN_IN_GLOBAL_LIMIT) in each window, kept apart from
   * wrong passwords so that asking for a link never locks an account. Refuses with a plain
   * message past a limit, the same whichever address was asked for.
   */
  async beginReset(address: string, now = new Date()): Promise<void> {
    const windowStart = new Date(Math.floor(now.getTime() / this.windowMs) * this.windowMs);
    const scopes = ['reset:kitchen', `reset:address:${address}`.slice(0, 80)];
    await retryingDeadlocks(() => this.countWindow(scopes, windowStart, +1));
    const counts = await this.sequelize.query<{ scope: string; failures: number }>(
      'SELECT scope, failures FROM sign_in_counters WHERE window_start = ? AND scope IN (?)',
      { replacements: [windowStart, scopes], type: QueryTypes.SELECT },
    );
    const count = (scope: string) => Number(counts.find((c) => c.scope === scope)?.failures ?? 0);
    const waitMs = windowStart.getTime() + this.windowMs - now.getTime();
    if (count(scopes[0]) > this.config.get('SIGN_IN_GLOBAL_LIMIT', { infer: true })) {
      throw new AppError(
        'too-many-requests',
        `Too many password links were asked for in the last minutes. Wait ${minutes(waitMs)}, then ask again.`,
      );
    }
    if (count(scopes[1]) > this.config.get('SIGN_IN_LIMIT', { infer: true })) {
      throw new AppError(
        'too-many-requests',
        `Too many password links were asked for from this device. Wait ${minutes(waitMs)}, then ask again.`,
      );
    }
  }

  /** The password was right: the attempt is not a failure after all, and the email starts afresh. */
  async succeeded(attempt: Attempt, now = new Date()) {
    await retryingDeadlocks(() => this.countWindow(attempt.scopes, attempt.windowStart, -1));
    await this.forget(attempt.email);
    // Old counts go on a successful sign-in only, away from the locked reads of a guessing run.
    await retryingDeadlocks(async () => {
      await this.sequelize.query('DELETE FROM sign_in_counters WHERE window_start < ?', {
        replacements: [new Date(attempt.windowStart.getTime() - this.windowMs)],
      });
      await this.sequelize.query('DELETE FROM sign_in_failures WHERE updated_at < ? AND (wait_until IS NULL OR wait_until < ?)', {
        replacements: [new Date(now.getTime() - FORGET_AFTER_MS), now],
      });
    });
  }

  /** Forgets an email's wrong passwords (a manager set a new password). */
  async forget(email: string) {
    await this.sequelize.query('DELETE FROM sign_in_failures WHERE email = ?', { replacements: [email] });
  }

  private async countWindow(scopes: string[], windowStart: Date, by: 1 | -1) {
    for (const scope of scopes) {
      if (by > 0) {
        await this.sequelize.query(
          'INSERT INTO sign_in_counters (scope, window_start, failures) VALUES (?, ?, 1) ON DUPLICATE KEY UPDATE failures = failures + 1',
          { replacements: [scope, windowStart] },
        );
      } else {
        await this.sequelize.query(
          'UPDATE sign_in_counters SET failures = GREATEST(failures - 1, 0) WHERE scope = ? AND window_start = ?',
          { replacements: [scope, windowStart] },
        );
      }
    }
  }

  /** Counts a wrong password for the email in one locked read and write; refuses while the email must wait. */
  private async countEmail(email: string, now: Date) {
    // The row exists before the transaction, so that the lock below is on that one row only.
    await this.sequelize.query('INSERT IGNORE INTO sign_in_failures (email, failures, updated_at) VALUES (?, 0, ?)', {
      replacements: [email, now],
    });
    await this.sequelize.transaction(async (transaction) => {
      const [row] = await this.sequelize.query<{ failures: number; wait_until: Date | null; updated_at: Date }>(
        'SELECT failures, wait_until, updated_at FROM sign_in_failures WHERE email = ? FOR UPDATE',
        { replacements: [email], type: QueryTypes.SELECT, transaction },
      );
      if (!row) throw new RowGone();
      const waitUntil = row.wait_until ? new Date(row.wait_until) : null;
      if (waitUntil && waitUntil > now) {
        const left = waitUntil.getTime() - now.getTime();
        if (row.failures >= LOCK_AT) {
          throw new AppError(
            'too-many-requests',
            `This account is locked for ${minutes(left)} after ${row.failures} wrong passwords in a row. ` +
              'Try again then, or ask a manager to set a new password, which unlocks it at once.',
          );
        }
        throw new AppError(
          'too-many-requests',
          `${row.failures} wrong passwords in a row for this account. Wait ${minutes(left)}, then try again.`,
        );
      }
      const stale = now.getTime() - new Date(row.updated_at).getTime() > FORGET_AFTER_MS;
      const failures = (stale ? 0 : Number(row.failures)) + 1;
      const wait = waitAfterFailures(failures);
      await this.sequelize.query('UPDATE sign_in_failures SET failures = ?, wait_until = ?, updated_at = ? WHERE email = ?', {
        replacements: [failures, wait ? new Date(now.getTime() + wait) : null, now, email],
        transaction,
      });
    });
  }
}
