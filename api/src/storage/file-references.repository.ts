import { Injectable } from '@nestjs/common';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';

/** Every column that names a stored file (migration 0014). A new one is added here, so no object it names is ever deleted. */
export const FILE_KEY_COLUMNS = [
  { table: 'specifications', column: 'storage_key' },
  { table: 'label_runs', column: 'storage_key' },
] as const;

/** The SQL of every stored file's key that a row names, each once. */
export const REFERENCED_KEYS_SQL = FILE_KEY_COLUMNS.map((c) => `SELECT ${c.column} AS k FROM ${c.table}`).join(' UNION ');

/** Which stored files rows still name. */
@Injectable()
export class FileReferencesRepository {
  constructor(private readonly sequelize: Sequelize) {}

  async isReferenced(key: string): Promise<boolean> {
    const rows = await this.sequelize.query<{ k: string }>(`SELECT k FROM (${REFERENCED_KEYS_SQL}) refs WHERE k = ? LIMIT 1`, {
      replacements: [key],
      type: QueryTypes.SELECT,
    });
    return rows.length > 0;
  }
}
