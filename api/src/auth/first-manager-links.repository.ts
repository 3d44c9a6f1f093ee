import { Injectable } from '@nestjs/common';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';

/** The only place that reads and writes first_manager_links (only each token's SHA-256 is kept). */
@Injectable()
export class FirstManagerLinksRepository {
  constructor(private readonly sequelize: Sequelize) {}

  /** Voids every unused link, then keeps a new one. */
  async replace(tokenSha256: string, expiresAt: Date, now: Date, transaction: Transaction) {
    await this.voidAll(now, transaction);
    await this.sequelize.query('INSERT INTO first_manager_links (token_sha256, expires_at, created_at) VALUES (?, ?, ?)', {
      replacements: [tokenSha256, expiresAt, now],
      transaction,
    });
  }

  /** Whether the link is unused and unexpired at `now`; locks its row until the transaction ends. */
  async isUsable(tokenSha256: string, now: Date, transaction: Transaction): Promise<boolean> {
    const [link] = await this.sequelize.query<{ expires_at: Date; used_at: Date | null }>(
      'SELECT expires_at, used_at FROM first_manager_links WHERE token_sha256 = ? FOR UPDATE',
      { replacements: [tokenSha256], type: QueryTypes.SELECT, transaction },
    );
    return !!link && link.used_at === null && new Date(link.expires_at) > now;
  }

  async voidAll(now: Date, transaction: Transaction) {
    await this.sequelize.query('UPDATE first_manager_links SET used_at = ? WHERE used_at IS NULL', { replacements: [now], transaction });
  }
}
