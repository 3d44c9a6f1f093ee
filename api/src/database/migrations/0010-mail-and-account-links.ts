import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * The outbox of the kitchen's e-mail and the one-time account links it carries.
 *
 * `mail_outbox`: a mail is written here in the transaction of the write it tells of (so it is
 * queued with that write or not at all) and sent by the sender loop afterwards; a mail that
 * could not be sent stays here with its last error, and one that failed every attempt stays as
 * failed until a manager sends it again. Nothing is deleted.
 *
 * `account_links`: an invitation (a user added without a password chooses one) or a password
 * reset, each a one-time link whose token only the SHA-256 of is kept. A new link of a user for
 * the same purpose voids the earlier ones.
 *
 * `users.password_hash` may now be empty: an invited user has no password until they choose one
 * and cannot sign in before.
 */
const opts = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
const binary = (length: number) => `VARCHAR(${length}) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin`;

export async function up({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.createTable(
    'mail_outbox',
    {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      /** invitation, password-reset, and what other features send (an approval asked for, a review due…). */
      kind: { type: binary(40), allowNull: false },
      /** A JSON array of addresses. */
      recipients: { type: DataTypes.JSON, allowNull: false },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      text: { type: DataTypes.TEXT('medium'), allowNull: false },
      html: { type: DataTypes.TEXT('medium'), allowNull: false },
      /** Text the body carries for its recipient alone (a one-time link's token), taken out of text and html once sent. */
      secret: { type: DataTypes.STRING(200), allowNull: true },
      state: { type: DataTypes.ENUM('queued', 'sent', 'failed'), allowNull: false, defaultValue: 'queued' },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      last_error: { type: DataTypes.STRING(1000), allowNull: true },
      /** When the sender next tries a queued mail (also its lease while one sender is trying it). */
      next_attempt_at: { type: DataTypes.DATE(3), allowNull: false },
      sent_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    opts,
  );
  await q.addIndex('mail_outbox', ['state', 'next_attempt_at'], { name: 'mail_outbox_due' });
  await q.addIndex('mail_outbox', ['created_at'], { name: 'mail_outbox_created' });

  await q.createTable(
    'account_links',
    {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      purpose: { type: DataTypes.ENUM('invitation', 'password-reset'), allowNull: false },
      token_sha256: { type: 'CHAR(64) CHARACTER SET ascii COLLATE ascii_bin', allowNull: false, unique: true },
      expires_at: { type: DataTypes.DATE(3), allowNull: false },
      used_at: { type: DataTypes.DATE(3), allowNull: true },
      /** A newer link of the same user and purpose was sent. */
      voided_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    opts,
  );
  await q.addIndex('account_links', ['user_id', 'purpose', 'created_at'], { name: 'account_links_user' });
  await q.changeColumn('users', 'password_hash', { type: DataTypes.STRING(100), allowNull: true });
}

export async function down({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.dropTable('account_links');
  await q.dropTable('mail_outbox');
  await sequelize.query("UPDATE users SET password_hash = '' WHERE password_hash IS NULL");
  await q.changeColumn('users', 'password_hash', { type: DataTypes.STRING(100), allowNull: false });
}
