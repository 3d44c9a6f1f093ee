import { Injectable, Logger, type OnModuleDestroy, type OnModuleInit } from '@nestjs/common';
import type { CounterEvent } from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { CounterEventsRepository } from './counter-events.repository';
import { CounterEvents } from './counter-events';

/** How often an instance with open streams reads the events written since its last read. */
export const POLL_MS = 300;
/**
 * How long a missing id below the newest one read is waited for. Ids are given out as rows are
 * inserted, not as their transactions commit, so a write that commits after a later one appears
 * below it; the event is inserted last in its write, just before the commit, so its wait is short.
 */
export const SETTLE_MS = 10_000;
/** Events are kept an hour, then pruned. */
export const KEEP_MS = 60 * 60_000;
const PRUNE_EVERY_MS = 60_000;
const BATCH = 500;

/**
 * The counter's events, shared by every API instance over one database. A write publishes its
 * event inside its own transaction (a rolled-back write publishes nothing); every instance with
 * open streams reads the table by increasing id every POLL_MS, and at once after a commit of its
 * own, and relays what it has not heard yet to its streams (CounterEvents). A read that fails (the
 * database away) is tried again at the next poll, from where it stopped, so nothing is lost.
 */
@Injectable()
export class CounterChannel implements OnModuleInit, OnModuleDestroy {
  private readonly logger = new Logger(CounterChannel.name);
  /** Every id at or below it has been relayed, or waited for SETTLE_MS; null while no stream is open. */
  private cursor: number | null = null;
  /** Ids above the cursor already relayed, with when they were read. */
  private readonly heard = new Map<number, number>();
  private timer: NodeJS.Timeout | null = null;
  private running: Promise<void> | null = null;
  private again = false;
  private failing = false;
  private prunedAt = 0;
  /** Raised at every start and stop, so a start that finishes after a stop does nothing. */
  private generation = 0;

  constructor(
    private readonly repo: CounterEventsRepository,
    private readonly events: CounterEvents,
  ) {}

  onModuleInit() {
    this.events.feedFrom({ started: () => this.start(), stopped: () => this.stop() });
  }

  onModuleDestroy() {
    this.stop();
  }

  /**
   * Writes the event in the write's transaction, for the counters of one kitchen (a question, the
   * day's display, an approval or settings there) or, with no kitchen, of every kitchen (a change to
   * the shared recipe book); once it commits, this instance's streams hear it at once.
   */
  async publish(event: CounterEvent, t: Transaction, kitchen: number | null = null): Promise<void> {
    await this.repo.add(event, kitchen, t);
    t.afterCommit(() => {
      this.poll();
      this.pruneNowAndThen();
    });
  }

  /** Resolves once every read started so far is done (the specs wait on it). */
  async idle(): Promise<void> {
    while (this.running) await this.running;
  }

  /** Reads and relays now (the timer and a commit of this instance's call it); a read already running is followed by one more. */
  poll(): void {
    if (this.cursor === null) return;
    if (this.running) {
      this.again = true;
      return;
    }
    this.running = (async () => {
      do {
        this.again = false;
        try {
          await this.readOnce();
          if (this.failing) this.logger.log('The counter’s events are read again.');
          this.failing = false;
        } catch (e) {
          if (!this.failing) this.logger.warn(`Could not read the counter’s events; trying again: ${String(e)}`);
          this.failing = true;
        }
      } while (this.again && this.cursor !== null);
    })().finally(() => {
      this.running = null;
    });
  }

  /** Removes the events older than KEEP_MS. */
  async prune(): Promise<void> {
    this.prunedAt = Date.now();
    await this.repo.prune(KEEP_MS);
  }

  private async start(): Promise<void> {
    const generation = ++this.generation;
    const { settled, recent } = await this.repo.horizon(SETTLE_MS);
    if (generation !== this.generation) return;
    const now = Date.now();
    this.heard.clear();
    for (const id of recent) this.heard.set(id, now);
    this.cursor = settled;
    this.timer = setInterval(() => {
      this.poll();
      this.pruneNowAndThen();
    }, POLL_MS);
    this.timer.unref();
  }

  private stop(): void {
    this.generation++;
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    this.cursor = null;
    this.heard.clear();
  }

  private async readOnce(): Promise<void> {
    const from = this.cursor;
    if (from === null) return;
    const rows = await this.repo.since(from, [...this.heard.keys()], BATCH);
    // A stop while reading: the rows are for no one.
    if (this.cursor !== from) return;
    const now = Date.now();
    for (const row of rows) {
      this.heard.set(row.id, now);
      this.events.deliver(row.event, row.kitchen);
    }
    // Ids heard SETTLE_MS ago move the cursor up: a missing id below them is no longer waited for.
    let settled = from;
    for (const [id, at] of this.heard) if (now - at >= SETTLE_MS && id > settled) settled = id;
    if (settled > from) {
      this.cursor = settled;
      for (const id of this.heard.keys()) if (id <= settled) this.heard.delete(id);
    }
    if (rows.length === BATCH) this.again = true;
  }

  private pruneNowAndThen(): void {
    if (Date.now() - this.prunedAt < PRUNE_EVERY_MS) return;
    this.prune().catch((e: unknown) => this.logger.warn(`Could not prune the counter’s events: ${String(e)}`));
  }
}
