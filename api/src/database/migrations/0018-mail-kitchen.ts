import type { MigrationContext } from '../migrator';

/**
 * Each mail of the outbox names the kitchen it is about (an approval waiting there, an invitation
 * to it), so each kitchen's managers see and send again their own kitchen's mail: null for a mail
 * about no kitchen in particular (a password reset, asked for before signing in), which a kitchen's
 * managers see when it is to someone who works there. Mails already queued had one kitchen: null.
 */
export async function up({ sequelize }: MigrationContext) {
  await sequelize.query('ALTER TABLE mail_outbox ADD COLUMN site_id INT NULL AFTER kind, ADD KEY mail_outbox_site (site_id, id)');
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query('ALTER TABLE mail_outbox DROP KEY mail_outbox_site, DROP COLUMN site_id');
}
