import { Global, Injectable, Module, type OnApplicationBootstrap, type OnModuleDestroy } from '@nestjs/common';
import { createConnection, type Connection } from 'mariadb';
import { Sequelize } from 'sequelize-typescript';
import type { Transaction } from 'sequelize';
import { retryingConflicts } from '../common/conflict-retry';
import { DATABASE_LOST, type DatabaseLostListener } from '../common/database-unavailable';

/** How long after one poll of the change revisions the next is sent (the poll itself is one small query). */
export const CHANGE_POLL_MS = 200;

/**
 * The staleness bound: a copy kept in memory is served only while the last poll that answered was
 * sent less than this long ago, so a change committed through another API instance (a session
 * ended, an account deactivated, a role changed or taken off, any kitchen write) is served
 * everywhere within this time; typically within one poll, 200 ms. Past it (the database slow or
 * away, the process too busy to poll) every read goes to the database again, as without copies.
 */
export const CHANGE_STALE_MS = 1000;

/**
 * A copy kept without a change heard is still read again after this long, so a row changed in the
 * database by hand (not through the API, which raises the revisions) is seen within this time.
 */
export const KEPT_AT_MOST_MS = 30_000;

/** What a kind of copy depends on: access (sessions, accounts, kitchen roles) or the book (every kitchen's row and items). */
export type ChangeKind = 'access' | 'book';

/** How long the poll waits to connect or for its answer before the copies stop being served. */
const POLL_TIMEOUT_MS = CHANGE_STALE_MS;

/**
 * One small query: the access revision (raised by every change to sessions, accounts and kitchen
 * roles, in its own transaction) and every kitchen's versions (raised by every kitchen write, see
 * SiteRepository.lock and .update).
 */
const POLL_SQL = `SELECT (SELECT revision FROM change_revisions WHERE name = 'access') AS access,
  (SELECT GROUP_CONCAT(id, ':', version, ':', book_version ORDER BY id SEPARATOR ' ') FROM sites) AS sites`;

/**
 * What tells every copy kept in memory that it no longer stands. Each kind of copy has a
 * generation, raised by a change heard from the database (a poll every CHANGE_POLL_MS that finds a
 * revision other than the last one) or made through this instance (at once, and again when its
 * transaction commits: read-your-writes). A copy is kept under the generation it was read at, and
 * served only while that is still the generation and the instance has heard from the database
 * within CHANGE_STALE_MS.
 */
@Injectable()
export class ChangeFeed implements OnApplicationBootstrap, OnModuleDestroy, DatabaseLostListener {
  private readonly generations: Record<ChangeKind, number> = { access: 0, book: 0 };
  private heard: { access: string; sites: string } | null = null;
  /** When (performance.now()) the last poll that answered was sent; -Infinity: none since the last failure. */
  private heardAt = -Infinity;
  private timer: NodeJS.Timeout | null = null;
  private running = false;
  /** The polls asked for, one after another (a poll never fails: it counts as not heard). */
  private polls: Promise<void> = Promise.resolve();
  /**
   * The poll's own connection, beside the pool: a poll never waits behind the requests' queries
   * (which, queued while the copies are not served, would keep them from being served again).
   */
  private connection: Connection | null = null;

  constructor(private readonly sequelize: Sequelize) {}

  async onApplicationBootstrap(): Promise<void> {
    this.running = true;
    await this.hear();
    this.schedule();
  }

  async onModuleDestroy(): Promise<void> {
    this.running = false;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    await this.polls;
    await this.disconnect();
  }

  /** The next poll, CHANGE_POLL_MS after the last one answered (the timer keeps no process alive). */
  private schedule(): void {
    if (!this.running) return;
    this.timer = setTimeout(() => void this.hear().then(() => this.schedule()), CHANGE_POLL_MS);
    this.timer.unref();
  }

  private async disconnect(): Promise<void> {
    const connection = this.connection;
    this.connection = null;
    await connection?.end().catch(() => connection.destroy());
  }

  private async ask(): Promise<{ access: bigint | number | string | null; sites: string | null } | undefined> {
    if (!this.connection) {
      const c = this.sequelize.config;
      this.connection = await createConnection({
        host: c.host,
        port: Number(c.port),
        database: c.database,
        user: c.username,
        password: c.password ?? undefined,
        connectTimeout: POLL_TIMEOUT_MS,
        queryTimeout: POLL_TIMEOUT_MS,
        bigIntAsNumber: false,
      });
      // A connection the server drops between polls says so as an event, which left unheard would end
      // the process: the copies stop being served, and the next poll connects again.
      const dropped = this.connection;
      dropped.on('error', () => {
        if (this.connection === dropped) {
          this.connection = null;
          this.lost();
        }
        dropped.destroy();
      });
    }
    const rows = await this.connection.query<{ access: bigint | number | string | null; sites: string | null }[]>(POLL_SQL);
    return rows[0];
  }

  generation(kind: ChangeKind): number {
    return this.generations[kind];
  }

  /** Whether copies may be served: polling, and the last poll that answered was sent within CHANGE_STALE_MS. */
  fresh(): boolean {
    return this.running && performance.now() - this.heardAt < CHANGE_STALE_MS;
  }

  /**
   * Asks the database now (what the timer does every CHANGE_POLL_MS); a test that changed rows by
   * hand calls it after raising the revision, instead of waiting for the next poll.
   */
  hear(): Promise<void> {
    this.polls = this.polls.then(() => this.poll());
    return this.polls;
  }

  /** The database could not be reached: nothing is served from memory until a poll answers again. */
  lost(): void {
    this.heardAt = -Infinity;
    this.heard = null;
  }

  private async poll(): Promise<void> {
    const sentAt = performance.now();
    try {
      const row = await this.ask();
      const now = { access: String(row?.access ?? ''), sites: String(row?.sites ?? '') };
      if (this.heard?.sites !== now.sites) this.bump('book');
      else if (this.heard.access !== now.access) this.bump('access');
      this.heard = now;
      this.heardAt = sentAt;
    } catch {
      this.lost();
      await this.disconnect();
    }
  }

  /** A book change bumps access too: a person's kitchens are named by the kitchens' rows. */
  private bump(kind: ChangeKind): void {
    this.generations.access++;
    if (kind === 'book') this.generations.book++;
  }

  /**
   * A kitchen write through this instance (SiteRepository raises the kitchen's versions in `t`):
   * this instance's copies go now and when `t` commits; the other instances hear the versions.
   */
  bookChanged(t?: Transaction | null): void {
    this.bump('book');
    t?.afterCommit(() => this.bump('book'));
  }

  /**
   * A change to sessions, accounts or kitchen roles, written by `work` with the access revision
   * raised in the same transaction (`t`, or one of its own), so every instance hears it once it
   * commits, and this instance's copies go at once.
   */
  async accessWrite<T>(t: Transaction | null | undefined, work: (t: Transaction) => Promise<T>): Promise<T> {
    const write = async (tx: Transaction) => {
      const result = await work(tx);
      await this.sequelize.query("UPDATE change_revisions SET revision = revision + 1 WHERE name = 'access'", { transaction: tx });
      this.bump('access');
      tx.afterCommit(() => this.bump('access'));
      return result;
    };
    if (t) return write(t);
    return retryingConflicts(() => this.sequelize.transaction((tx) => write(tx)));
  }
}

/**
 * Copies of what one kind of change invalidates, by key (a session, a person), each served while
 * the feed says it stands (ChangeFeed) and for at most KEPT_AT_MOST_MS. A read that a change
 * overtook while it ran is given to its caller but not kept.
 */
export class KeptUntilChanged<K, V> {
  private readonly kept = new Map<K, { generation: number; at: number; value: V }>();
  /** Reads running, by key, with the generation they started at: requests that miss together share one. */
  private readonly reading = new Map<K, { generation: number; value: Promise<V> }>();

  constructor(
    private readonly feed: ChangeFeed,
    private readonly kind: ChangeKind,
    /** Past this many copies, all are dropped and read again (a bound on memory, not on time). */
    private readonly most = 10_000,
  ) {}

  async get(key: K, read: () => Promise<V>, keep: (value: V) => boolean = () => true): Promise<V> {
    const generation = this.feed.generation(this.kind);
    const hit = this.kept.get(key);
    if (hit && hit.generation === generation && this.feed.fresh() && performance.now() - hit.at < KEPT_AT_MOST_MS) return hit.value;
    const running = this.reading.get(key);
    if (running && running.generation === generation) return running.value;
    const at = performance.now();
    const value = read();
    this.reading.set(key, { generation, value });
    try {
      const v = await value;
      if (this.feed.generation(this.kind) === generation && keep(v)) {
        if (this.kept.size >= this.most) this.kept.clear();
        this.kept.set(key, { generation, at, value: v });
      } else this.kept.delete(key);
      return v;
    } finally {
      if (this.reading.get(key)?.value === value) this.reading.delete(key);
    }
  }

  /** Drops one copy (this instance changed it in a way no other instance needs to hear, a session renewed). */
  forget(key: K): void {
    this.kept.delete(key);
  }
}

@Global()
@Module({
  providers: [ChangeFeed, { provide: DATABASE_LOST, useExisting: ChangeFeed }],
  exports: [ChangeFeed, DATABASE_LOST],
})
export class ChangeFeedModule {}
