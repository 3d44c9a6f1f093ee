import { createConnection, type Connection } from 'mariadb';

/**
 * What goes wrong at the row: the database refuses the statement (a full disk, a bug: a trigger
 * raises an SQL error), or the connection under the write's transaction is killed while the row
 * is being inserted (the server dropped it: KILL CONNECTION).
 */
export type FaultKind = 'refused' | 'connection-lost';

export interface InsertFault {
  /** How many rows the write had sent into the table when the fault struck (all of them if it never did). */
  seen(): Promise<number>;
  /** Whether the fault has struck. */
  struck(): Promise<boolean>;
  /** Drops the trigger and its counter; the database is as it was. */
  remove(): Promise<void>;
}

let faults = 0;

/** The owner's connection to the test's database (the runtime user may create no trigger). */
async function asOwner(): Promise<Connection> {
  return createConnection({
    host: process.env.DB_HOST,
    port: Number(process.env.DB_PORT),
    user: process.env.DB_OWNER_USER ?? process.env.DB_USER,
    password: process.env.DB_OWNER_USER ? process.env.DB_OWNER_PASSWORD : process.env.DB_PASSWORD,
    database: process.env.DB_NAME,
  });
}

/**
 * Makes the nth row inserted into `table` fail, once, inside MariaDB: a BEFORE INSERT trigger
 * counts the rows in a non-transactional (Aria) table, so the count survives the write's rollback,
 * and at the nth it raises an SQL error ('refused') or waits while another connection kills it
 * with KILL CONNECTION ('connection-lost'). The rows before it were sent and inserted by the
 * server, so the write is interrupted half-way. Nothing of it is in the product: the app runs as
 * it does in production, as its runtime user.
 */
export async function failInsert(table: string, nth: number, kind: FaultKind = 'refused'): Promise<InsertFault> {
  const name = `test_fault_${++faults}`;
  const owner = await asOwner();
  await owner.query(`CREATE TABLE \`${name}\` (n INT NOT NULL, struck BOOLEAN NOT NULL) ENGINE=Aria`);
  await owner.query(`INSERT INTO \`${name}\` VALUES (0, FALSE)`);
  const strike =
    kind === 'refused'
      ? `SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'The database refused row ${nth} of ${table}.'`
      : // The watcher below kills this connection within the wait (a second is plenty; 30 is the limit).
        `DO SLEEP(30); SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'The connection was not killed.'`;
  await owner.query(
    `CREATE TRIGGER \`${name}\` BEFORE INSERT ON \`${table}\` FOR EACH ROW BEGIN
       IF NOT (SELECT struck FROM \`${name}\`) THEN
         UPDATE \`${name}\` SET n = n + 1;
         IF (SELECT n FROM \`${name}\`) = ${nth} THEN UPDATE \`${name}\` SET struck = TRUE; ${strike}; END IF;
       END IF;
     END`,
  );
  const read = async () => (await owner.query<{ n: number; struck: number }[]>(`SELECT n, struck FROM \`${name}\``))[0];
  let watching = kind === 'connection-lost';
  // While the trigger runs, its connection acts as the trigger's definer, the owner: the owner sees
  // it waiting and ends it.
  const watcher = (async () => {
    if (!watching) return;
    const killer = await asOwner();
    try {
      while (watching) {
        const [sleeping] = await killer.query<{ id: bigint }[]>(
          "SELECT ID AS id FROM information_schema.PROCESSLIST WHERE STATE = 'User sleep' AND DB = DATABASE() AND ID <> CONNECTION_ID()",
        );
        if (sleeping) {
          await killer.query(`KILL CONNECTION ${String(sleeping.id)}`);
          return;
        }
        await new Promise((r) => setTimeout(r, 20));
      }
    } finally {
      await killer.end();
    }
  })().then(
    () => undefined,
    (e: unknown) => (e instanceof Error ? e : new Error(String(e))),
  );
  const struck = async () => Boolean((await read()).struck);
  return {
    async seen() {
      const { n, struck } = await read();
      return struck ? n - 1 : n;
    },
    struck,
    async remove() {
      watching = false;
      try {
        const failed = await watcher;
        if (failed) throw failed;
        await owner.query(`DROP TRIGGER IF EXISTS \`${name}\``);
        await owner.query(`DROP TABLE IF EXISTS \`${name}\``);
      } finally {
        await owner.end();
      }
    },
  };
}
