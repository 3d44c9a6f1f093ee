import { BaseError, ConnectionError } from 'sequelize';

/**
 * Told when a request found the database away (ChangeFeed, under this token): what is kept in
 * memory is then no longer served, since a change made meanwhile could not be heard.
 */
export interface DatabaseLostListener {
  lost(): void;
}
export const DATABASE_LOST = Symbol('DATABASE_LOST');

/** What every request answers while the database cannot be reached (503, database-unavailable). */
export const DATABASE_UNAVAILABLE_MESSAGE =
  'Crumbproof cannot reach its database just now, so this could not be done. Try again in a moment; if it keeps happening, the database needs restarting.';

/**
 * Error codes of the mariadb driver (its SqlError's `code`) and of Node's sockets that mean the
 * connection to the server is gone or was never made, rather than a statement refused. The driver's
 * own are in node_modules/mariadb/lib/misc/errors.js (45001–45065).
 */
const CONNECTION_CODES = new Set([
  // Node's sockets.
  'ECONNREFUSED',
  'ECONNRESET',
  'EPIPE',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'EADDRNOTAVAIL',
  'ENOTFOUND',
  // The driver's.
  'ER_CONNECTION_ALREADY_CLOSED',
  'ER_CMD_NOT_EXECUTED_DESTROYED',
  'ER_SOCKET_UNEXPECTED_CLOSE',
  'ER_CONNECTION_TIMEOUT',
  'ER_CMD_CONNECTION_CLOSED',
  'ER_SOCKET',
  'ER_SOCKET_TIMEOUT',
  'ER_POOL_ALREADY_CLOSED',
  'ER_GET_CONNECTION_TIMEOUT',
  'ER_ADD_CONNECTION_CLOSED_POOL',
  'ER_CLOSING_POOL',
  'ER_INITIAL_TIMEOUT_ERROR',
  'ER_PING_TIMEOUT',
  'ER_POOL_NOT_INITIALIZED',
  'ER_POOL_NO_CONNECTION',
  // The server's, as it shuts down or drops the connection (MariaDB error codes 1053, 1927, 2006, 2013).
  'ER_SERVER_SHUTDOWN',
  'ER_CONNECTION_KILLED',
  'CR_SERVER_GONE_ERROR',
  'CR_SERVER_LOST',
]);

/** The server's numbers for the same: shutdown in progress, connection killed, server gone, lost. */
const CONNECTION_ERRNOS = new Set([1053, 1927, 2006, 2013]);

interface DriverError {
  code?: unknown;
  errno?: unknown;
  fatal?: unknown;
  sqlState?: unknown;
}

function isConnectionLoss(error: DriverError & { name?: unknown }): boolean {
  if (typeof error.code === 'string' && CONNECTION_CODES.has(error.code)) return true;
  if (error.name !== 'SqlError') return false;
  if (typeof error.errno === 'number' && CONNECTION_ERRNOS.has(error.errno)) return true;
  // SQLSTATE class 08 is "connection exception" (ISO/IEC 9075-2); the driver marks an error after
  // which its connection cannot be used again as fatal.
  if (typeof error.sqlState === 'string' && error.sqlState.startsWith('08')) return true;
  return error.fatal === true;
}

/**
 * Whether an error means the API cannot reach its database (a connection refused, lost or timed
 * out, the pool giving none), as Sequelize raises it (ConnectionError and its kinds:
 * ConnectionRefusedError, ConnectionAcquireTimeoutError, HostNotReachableError, …) or as a
 * statement's DatabaseError carrying the driver's SqlError; the chain of causes is followed.
 */
export function isDatabaseUnavailable(error: unknown): boolean {
  const seen = new Set<unknown>();
  let fromDatabase = false;
  let lost = false;
  let current: unknown = error;
  while (current && typeof current === 'object' && !seen.has(current)) {
    seen.add(current);
    if (current instanceof ConnectionError) return true;
    const driver = current as DriverError & { name?: unknown; parent?: unknown; original?: unknown; cause?: unknown };
    // A socket's code counts only in a database error's chain (the mail server's are its own).
    fromDatabase ||= current instanceof BaseError || driver.name === 'SqlError';
    lost ||= isConnectionLoss(driver);
    current = driver.parent ?? driver.original ?? driver.cause;
  }
  return fromDatabase && lost;
}
