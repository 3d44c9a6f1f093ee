import type { MigrationContext } from '../migrator';

/**
 * What every API instance over one database must share:
 * - counter_events: the counter's events, each written inside the transaction of the write that
 *   causes it (a rolled-back write leaves none), read by every instance with open events streams
 *   by its increasing id and relayed to them; rows older than an hour are pruned.
 * - public_page_hits: the public product page's requests per address and one-minute window, so
 *   the limit per address holds across instances; windows past their minute are pruned.
 */
const opts = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci';

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(
    `CREATE TABLE counter_events (
      id BIGINT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      body JSON NOT NULL,
      created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      KEY counter_events_created (created_at)
    ) ${opts}`,
  );
  await sequelize.query(
    `CREATE TABLE public_page_hits (
      address VARCHAR(80) NOT NULL,
      window_start DATETIME NOT NULL,
      hits INT NOT NULL DEFAULT 0,
      PRIMARY KEY (address, window_start),
      KEY public_page_hits_window (window_start)
    ) ${opts}`,
  );
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query('DROP TABLE IF EXISTS public_page_hits');
  await sequelize.query('DROP TABLE IF EXISTS counter_events');
}
