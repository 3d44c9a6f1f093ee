import { Injectable, Logger } from '@nestjs/common';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { AppError } from '../common/app-error';

/** How long the health check waits for the database before it says it cannot be reached. */
export const PROBE_TIMEOUT_MS = 2000;

/** The one query of the health check: can the API reach its database? */
@Injectable()
export class DatabaseProbeRepository {
  private readonly logger = new Logger('Health');

  constructor(private readonly sequelize: Sequelize) {}

  /** Resolves when the database answers within PROBE_TIMEOUT_MS; otherwise throws database-unavailable, never waiting longer. */
  async ping(): Promise<void> {
    const query = this.sequelize.query('SELECT 1 AS ok', { type: QueryTypes.SELECT });
    let timer: NodeJS.Timeout | undefined;
    const late = new Promise<'late'>((resolve) => {
      timer = setTimeout(() => resolve('late'), PROBE_TIMEOUT_MS);
    });
    try {
      const answer = await Promise.race([query, late]);
      if (answer !== 'late') return;
      // The query may still end one way or the other; nobody waits for it.
      query.catch(() => undefined);
      this.logger.warn(`The database did not answer the health check within ${PROBE_TIMEOUT_MS} ms.`);
      throw unavailable(`it did not answer within ${PROBE_TIMEOUT_MS / 1000} seconds`);
    } catch (e) {
      if (e instanceof AppError) throw e;
      this.logger.warn(`The database cannot be reached: ${e instanceof Error ? e.message : String(e)}`);
      throw unavailable('the connection to it failed');
    } finally {
      clearTimeout(timer);
    }
  }
}

function unavailable(why: string): AppError {
  return new AppError(
    'database-unavailable',
    `Crumbproof is running but cannot reach its database (${why}): nothing can be read or saved until it answers again.`,
  );
}
