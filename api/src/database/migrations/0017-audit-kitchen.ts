import type { MigrationContext } from '../migrator';

/**
 * Each audit event names the kitchen it was recorded at (the request's kitchen), so each kitchen's
 * managers read their own kitchen's trail: null for an event at no kitchen in particular (before
 * any was set up, a sign-in, the command line). Events already recorded had one kitchen: null.
 */
export async function up({ sequelize }: MigrationContext) {
  await sequelize.query('ALTER TABLE audit_events ADD COLUMN site_id INT NULL AFTER address, ADD KEY audit_events_site (site_id, at)');
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query('ALTER TABLE audit_events DROP KEY audit_events_site, DROP COLUMN site_id');
}
