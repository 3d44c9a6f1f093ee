import { QueryTypes, type Sequelize } from 'sequelize';

/**
 * The tables whose rows the API may only read and add: MariaDB itself refuses its runtime user
 * an UPDATE or DELETE there. Privileges add up across levels, so the runtime user holds no
 * database-wide privilege and gets these table by table.
 */
export const APPEND_ONLY_TABLES = ['audit_events', 'product_approvals', 'label_stale_handled'] as const;
/** Read only for the API: the migrations' own record. */
const READ_ONLY_TABLES = ['schema_migrations'];

/** The owner's account (user and host) and the database of the connection, and every base table in it. */
async function ownerView(owner: Sequelize) {
  const [me] = await owner.query<{ me: string; db: string }>('SELECT CURRENT_USER() AS me, DATABASE() AS db', {
    type: QueryTypes.SELECT,
  });
  const at = me.me.lastIndexOf('@');
  const tables = await owner.query<{ name: string }>(
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' ORDER BY table_name",
    { type: QueryTypes.SELECT },
  );
  return { account: me.me, user: me.me.slice(0, at), host: me.me.slice(at + 1), db: me.db, tables: tables.map((t) => t.name) };
}

const id = (name: string) => `\`${name.replace(/`/g, '``')}\``;

export type GrantOutcome = { granted: string[] } | { skipped: 'runtime-is-owner' };

/**
 * Run by the owner after every migration run, so every table (a new one too) is covered: SELECT,
 * INSERT, UPDATE and DELETE on every table but the append-only ones (SELECT and INSERT) and the
 * migrations' record (SELECT). The runtime user is taken at the owner's host (both are created
 * alike, as mariadb.mjs does). Nothing is granted when the runtime user is the owner.
 */
export async function grantRuntime(owner: Sequelize, runtimeUser: string): Promise<GrantOutcome> {
  const me = await ownerView(owner);
  if (me.user === runtimeUser) return { skipped: 'runtime-is-owner' };
  const grantee = `${owner.escape(runtimeUser)}@${owner.escape(me.host)}`;
  for (const name of me.tables) {
    const privileges = (APPEND_ONLY_TABLES as readonly string[]).includes(name)
      ? 'SELECT, INSERT'
      : READ_ONLY_TABLES.includes(name)
        ? 'SELECT'
        : 'SELECT, INSERT, UPDATE, DELETE';
    try {
      await owner.query(`GRANT ${privileges} ON ${id(me.db)}.${id(name)} TO ${grantee}`);
    } catch (err) {
      const why = err instanceof Error ? err.message : String(err);
      throw new Error(
        `The owner ${me.account} could not grant ${privileges} on ${name} to the runtime user ${runtimeUser}@${me.host}: ${why}. ` +
          `Create that user at host ${me.host} and give the owner ALL PRIVILEGES WITH GRANT OPTION on ${me.db}.`,
        { cause: err },
      );
    }
  }
  return { granted: me.tables };
}

/**
 * Takes back what grantRuntime gave on this database (MariaDB keeps table grants after a DROP
 * DATABASE): the tests' throwaway databases call it before dropping theirs.
 */
export async function revokeRuntime(owner: Sequelize, runtimeUser: string): Promise<void> {
  const me = await ownerView(owner);
  if (me.user === runtimeUser) return;
  const grantee = `${owner.escape(runtimeUser)}@${owner.escape(me.host)}`;
  for (const name of me.tables) {
    await owner.query(`REVOKE ALL PRIVILEGES ON ${id(me.db)}.${id(name)} FROM ${grantee}`).catch(() => undefined);
  }
}
