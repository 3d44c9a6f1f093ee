/**
 * MariaDB ends a transaction with error 1213 when it loses to another: a deadlock between two
 * transactions of one server, or, on a Galera cluster, a certification conflict (a transaction on
 * another node committed a write to the same rows first, such as the kitchen's row every kitchen
 * write locks; MariaDB Galera Cluster documentation, "Galera Cluster: certification-based
 * replication"). Nothing of the lost transaction is kept, so running it again from the start,
 * reading what the winner wrote, is the cure. 1205 (a lock wait too long) is retried the same way.
 */
export const RETRIED_ERRNOS: ReadonlySet<number> = new Set([1213, 1205]);

/** How many times a transaction is run in all before its conflict is given to the caller. */
export const ATTEMPTS = 10;

/** The server's error number of a failed statement or commit, as Sequelize or the driver gives it. */
export function errnoOf(err: unknown): number | undefined {
  const e = err as { errno?: unknown; original?: { errno?: unknown }; parent?: { errno?: unknown } } | null;
  const n = e?.original?.errno ?? e?.parent?.errno ?? e?.errno;
  return typeof n === 'number' ? n : undefined;
}

/**
 * Sequelize's word for a statement sent after MariaDB ended the transaction on such a conflict
 * (the other statements of the same transaction, running beside the one that lost, get it).
 */
const ENDED_BY_CONFLICT = /^rollback has been called on this transaction/;

/** Whether MariaDB says to run the failed transaction again. */
export function isRetriedConflict(err: unknown): boolean {
  const errno = errnoOf(err);
  if (errno !== undefined) return RETRIED_ERRNOS.has(errno);
  return err instanceof Error && ENDED_BY_CONFLICT.test(err.message);
}

/** The longest pause between two attempts. */
const MAX_PAUSE_MS = 500;

/**
 * Runs `attempt` again, after a random pause that doubles with each attempt (up to MAX_PAUSE_MS:
 * "exponential backoff with jitter"), while it fails with a conflict MariaDB says to retry. Many
 * writers on one kitchen's lock at once spread out instead of meeting again at the next attempt.
 */
export async function retryingConflicts<T>(attempt: () => Promise<T>, attempts = ATTEMPTS): Promise<T> {
  for (let n = 1; ; n++) {
    try {
      return await attempt();
    } catch (err) {
      if (n >= attempts || !isRetriedConflict(err)) throw err;
      await new Promise((r) => setTimeout(r, Math.random() * Math.min(MAX_PAUSE_MS, 25 * 2 ** (n - 1))));
    }
  }
}
