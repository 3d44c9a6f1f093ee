import { Injectable } from '@nestjs/common';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { retryingConflicts } from '../common/conflict-retry';

/**
 * The only place that reads and writes public_page_hits (migration 0015): the public page's
 * requests, one row per address and window, in the database so that every API instance counts
 * the same requests.
 */
@Injectable()
export class PublicPageHitsRepository {
  constructor(private readonly sequelize: Sequelize) {}

  /** Counts one request of the address in the window and answers the window's count with it. */
  async count(address: string, windowStart: Date): Promise<number> {
    // Two instances over different Galera nodes counting one address at once: one loses with 1213 and counts again.
    await retryingConflicts(() =>
      this.sequelize.query(
        'INSERT INTO public_page_hits (address, window_start, hits) VALUES (?, ?, 1) ON DUPLICATE KEY UPDATE hits = hits + 1',
        { replacements: [address, windowStart] },
      ),
    );
    const row = await this.sequelize.query<{ hits: number }>('SELECT hits FROM public_page_hits WHERE address = ? AND window_start = ?', {
      replacements: [address, windowStart],
      type: QueryTypes.SELECT,
      plain: true,
    });
    return Number(row?.hits ?? 0);
  }

  /** Removes the windows that started before `before`. */
  async prune(before: Date): Promise<void> {
    await this.sequelize.query('DELETE FROM public_page_hits WHERE window_start < ?', { replacements: [before] });
  }
}
