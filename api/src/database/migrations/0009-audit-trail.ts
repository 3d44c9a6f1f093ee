import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * The audit trail: one row per write of the kitchen's data (who, when, what, the record before
 * and after), per sign-in, sign-out and refused access. Append-only: after every migration run
 * the owner grants the API's runtime user only SELECT and INSERT on this table
 * (runtime-grants.ts), so MariaDB itself refuses an UPDATE or DELETE of its rows. The actor's
 * name and role are copied, so a later rename does not rewrite history; there is no foreign key
 * to users for the same reason.
 */
const opts = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
/** Codes compare byte for byte (as in migration 0005). */
const binary = (length: number) => `VARCHAR(${length}) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin`;

export async function up({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.createTable(
    'audit_events',
    {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      at: { type: DataTypes.DATE(3), allowNull: false },
      /** Null for an anonymous event (a refused sign-in, a refused request without a session). */
      actor_id: { type: DataTypes.INTEGER, allowNull: true },
      actor_name: { type: DataTypes.STRING(160), allowNull: true },
      actor_role: { type: DataTypes.STRING(20), allowNull: true },
      action: { type: binary(40), allowNull: false },
      /** ingredient, recipe, user, kitchen, label-run, label-settings, counter-day, counter-question, specification… */
      record_kind: { type: binary(40), allowNull: true },
      /** The record's id there: an item's code, a user's number, a run's number. */
      record_id: { type: binary(120), allowNull: true },
      summary: { type: DataTypes.STRING(1000), allowNull: false },
      before: { type: DataTypes.JSON, allowNull: true },
      after: { type: DataTypes.JSON, allowNull: true },
      address: { type: DataTypes.STRING(64), allowNull: true },
    },
    opts,
  );
  await q.addIndex('audit_events', ['at'], { name: 'audit_events_at' });
  await q.addIndex('audit_events', ['actor_id', 'at'], { name: 'audit_events_actor' });
  await q.addIndex('audit_events', ['action', 'at'], { name: 'audit_events_action' });
  await q.addIndex('audit_events', ['record_id', 'at'], { name: 'audit_events_record' });
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.getQueryInterface().dropTable('audit_events');
}
