import { Injectable } from '@nestjs/common';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type { AccountLinkPurpose } from '@crumbproof/shared';

export interface AccountLinkRow {
  id: string;
  userId: number;
  purpose: AccountLinkPurpose;
  expiresAt: Date;
  usedAt: Date | null;
  voidedAt: Date | null;
}

interface RawLink {
  id: string | number;
  user_id: number;
  purpose: AccountLinkPurpose;
  expires_at: Date | string;
  used_at: Date | string | null;
  voided_at: Date | string | null;
}

const date = (v: Date | string | null) => (v === null ? null : new Date(v));

/** The only place that reads and writes account_links (migration 0010): only each token's SHA-256 is kept. */
@Injectable()
export class AccountLinksRepository {
  constructor(private readonly sequelize: Sequelize) {}

  /** Voids the user's unused links of this purpose, then keeps a new one. */
  async replace(userId: number, purpose: AccountLinkPurpose, tokenSha256: string, expiresAt: Date, now: Date, transaction: Transaction) {
    await this.sequelize.query(
      'UPDATE account_links SET voided_at = ? WHERE user_id = ? AND purpose = ? AND used_at IS NULL AND voided_at IS NULL',
      { replacements: [now, userId, purpose], transaction },
    );
    await this.sequelize.query(
      'INSERT INTO account_links (user_id, purpose, token_sha256, expires_at, created_at) VALUES (?, ?, ?, ?, ?)',
      { replacements: [userId, purpose, tokenSha256, expiresAt, now], transaction },
    );
  }

  /** The link with this token's hash, locked until the transaction ends when one is given. */
  async find(tokenSha256: string, transaction?: Transaction): Promise<AccountLinkRow | null> {
    const [row] = await this.sequelize.query<RawLink>(
      `SELECT id, user_id, purpose, expires_at, used_at, voided_at FROM account_links WHERE token_sha256 = ?${transaction ? ' FOR UPDATE' : ''}`,
      { replacements: [tokenSha256], type: QueryTypes.SELECT, transaction },
    );
    if (!row) return null;
    return {
      id: String(row.id),
      userId: row.user_id,
      purpose: row.purpose,
      expiresAt: new Date(row.expires_at),
      usedAt: date(row.used_at),
      voidedAt: date(row.voided_at),
    };
  }

  /** The link is used; every other unused link of the user (either purpose) is void. */
  async use(id: string, userId: number, now: Date, transaction: Transaction) {
    await this.sequelize.query('UPDATE account_links SET used_at = ? WHERE id = ?', { replacements: [now, id], transaction });
    await this.sequelize.query(
      'UPDATE account_links SET voided_at = ? WHERE user_id = ? AND id <> ? AND used_at IS NULL AND voided_at IS NULL',
      {
        replacements: [now, userId, id],
        transaction,
      },
    );
  }

  /** How many links of this purpose the user was sent since `since`. */
  async countSince(userId: number, purpose: AccountLinkPurpose, since: Date, transaction?: Transaction): Promise<number> {
    const [row] = await this.sequelize.query<{ n: number | string }>(
      'SELECT COUNT(*) AS n FROM account_links WHERE user_id = ? AND purpose = ? AND created_at >= ?',
      { replacements: [userId, purpose, since], type: QueryTypes.SELECT, transaction },
    );
    return Number(row.n);
  }
}
