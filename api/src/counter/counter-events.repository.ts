import { Injectable } from '@nestjs/common';
import type { CounterEvent } from '@crumbproof/shared';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';

export interface CounterEventRow {
  id: number;
  event: CounterEvent;
  /** The kitchen whose counters it is for; null: every kitchen's (a change to the shared recipe book). */
  kitchen: number | null;
}

/** A row's body: the event, with the kitchen it is for when it is for one. */
type EventBody = CounterEvent & { kitchen?: number };

function parsed(body: unknown): Omit<CounterEventRow, 'id'> {
  const { kitchen, ...event } = (typeof body === 'string' ? JSON.parse(body) : body) as EventBody;
  return { event, kitchen: typeof kitchen === 'number' ? kitchen : null };
}

/**
 * The only place that reads and writes counter_events (migration 0015): the counter's events as
 * every API instance over the database reads them, by their increasing id. Times are the
 * database's own (NOW(3)), the same for every instance.
 */
@Injectable()
export class CounterEventsRepository {
  constructor(private readonly sequelize: Sequelize) {}

  /** Adds the event for one kitchen's counters (null: every kitchen's) inside the write's own transaction: kept with the write, or not at all. */
  async add(event: CounterEvent, kitchen: number | null, t: Transaction): Promise<void> {
    const body: EventBody = kitchen === null ? event : { ...event, kitchen };
    await this.sequelize.query('INSERT INTO counter_events (body) VALUES (?)', { replacements: [JSON.stringify(body)], transaction: t });
  }

  /**
   * Where a reader starts: the newest id added more than `settleMs` ago, and the ids added since
   * (committed already, so a reader that starts now treats them as heard).
   */
  async horizon(settleMs: number): Promise<{ settled: number; recent: number[] }> {
    const rows = await this.sequelize.query<{ id: number | string; recent: number | string }>(
      `SELECT id, 1 AS recent FROM counter_events WHERE created_at >= NOW(3) - INTERVAL ? MICROSECOND
       UNION ALL
       SELECT COALESCE(MAX(id), 0), 0 FROM counter_events WHERE created_at < NOW(3) - INTERVAL ? MICROSECOND`,
      { replacements: [settleMs * 1000, settleMs * 1000], type: QueryTypes.SELECT },
    );
    const settled = Number(rows.find((r) => Number(r.recent) === 0)?.id ?? 0);
    return { settled, recent: rows.filter((r) => Number(r.recent) === 1).map((r) => Number(r.id)) };
  }

  /** The events above `after` but those in `heard`, oldest id first, at most `limit`. */
  async since(after: number, heard: readonly number[], limit: number): Promise<CounterEventRow[]> {
    const rows = await this.sequelize.query<{ id: number | string; body: unknown }>(
      `SELECT id, body FROM counter_events WHERE id > ?${heard.length > 0 ? ' AND id NOT IN (?)' : ''} ORDER BY id LIMIT ?`,
      { replacements: heard.length > 0 ? [after, heard, limit] : [after, limit], type: QueryTypes.SELECT },
    );
    return rows.map((r) => ({ id: Number(r.id), ...parsed(r.body) }));
  }

  /** Removes the events added more than `olderThanMs` ago. */
  async prune(olderThanMs: number): Promise<void> {
    await this.sequelize.query('DELETE FROM counter_events WHERE created_at < NOW(3) - INTERVAL ? MICROSECOND', {
      replacements: [olderThanMs * 1000],
    });
  }
}
