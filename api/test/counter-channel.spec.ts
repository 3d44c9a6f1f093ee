import type { CounterEvent } from '@crumbproof/shared';
import { Logger } from '@nestjs/common';
import type { NestFastifyApplication } from '@nestjs/platform-fastify';
import { QueryTypes } from 'sequelize';
import { createApp } from '../src/app.factory';
import { CounterChannel, POLL_MS, SETTLE_MS } from '../src/counter/counter-channel';
import { CounterEvents } from '../src/counter/counter-events';
import { CounterEventsRepository } from '../src/counter/counter-events.repository';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * The counter's events through the database, with two API instances over one MariaDB: an event
 * written in a transaction through one is heard by the streams open on both, once each, in the
 * order written; a write that commits after a later one is still heard; a rolled-back write is
 * heard nowhere; old events are pruned.
 */
describe('the counter’s events shared through the database (real MariaDB, two instances)', () => {
  let a: TestApp;
  let b: NestFastifyApplication;
  const heardOnA: CounterEvent[] = [];
  const heardOnB: CounterEvent[] = [];
  let stopA: () => void;
  let stopB: () => void;

  beforeAll(async () => {
    a = await startTestApp({ seed: true });
    b = await createApp({ logLevel: 'silent' });
    stopA = await a.app.get(CounterEvents).subscribe((e) => heardOnA.push(e));
    stopB = await b.get(CounterEvents).subscribe((e) => heardOnB.push(e));
  });
  afterAll(async () => {
    stopA?.();
    stopB?.();
    await b?.close();
    await a?.close();
  });

  const channelA = () => a.app.get(CounterChannel);
  const publishOnA = (event: CounterEvent) => a.sequelize.transaction((t) => channelA().publish(event, t));
  const day = (n: number): CounterEvent => ({ type: 'display-changed', date: `2026-11-${String(n).padStart(2, '0')}` });
  const rows = async () =>
    Number((await a.sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM counter_events', { type: QueryTypes.SELECT }))[0].n);

  /** Waits until `done` holds, at most `ms`. */
  async function until(done: () => boolean, ms = 3000): Promise<void> {
    const end = Date.now() + ms;
    while (!done() && Date.now() < end) await new Promise((r) => setTimeout(r, 20));
  }
  /** Lets both instances read at least twice more. */
  const twoPolls = async () => {
    await new Promise((r) => setTimeout(r, 2 * POLL_MS + 100));
    await channelA().idle();
    await b.get(CounterChannel).idle();
  };
  const since = (list: CounterEvent[], from: number) => list.slice(from);

  it('relays a write through one instance to the streams open on the other, and at once to its own', async () => {
    const [fromA, fromB] = [heardOnA.length, heardOnB.length];
    const chef = await a.signIn('chef@example.com');
    const res = await a.req('PUT', '/api/counter/today', chef, { date: '2026-12-01', products: [] });
    expect(res.statusCode).toBe(200);
    const answered = Date.now();
    await until(() => heardOnA.length > fromA);
    // Its own instance reads right after the commit, without waiting for the next poll.
    expect(Date.now() - answered).toBeLessThan(POLL_MS / 2);
    await until(() => heardOnB.length > fromB);
    expect(since(heardOnA, fromA)).toEqual([{ type: 'display-changed', date: '2026-12-01' }]);
    expect(since(heardOnB, fromB)).toEqual([{ type: 'display-changed', date: '2026-12-01' }]);
  });

  it('relays events in the order they were written, each once, however many polls pass', async () => {
    const [fromA, fromB] = [heardOnA.length, heardOnB.length];
    const written = Array.from({ length: 30 }, (_, i) => day(i + 1));
    for (const event of written) await publishOnA(event);
    await until(() => heardOnA.length - fromA >= 30 && heardOnB.length - fromB >= 30);
    await twoPolls();
    expect(since(heardOnA, fromA)).toEqual(written);
    expect(since(heardOnB, fromB)).toEqual(written);
  });

  it('still relays a write that commits after a later one was read (its id is below the one read)', async () => {
    const [fromA, fromB] = [heardOnA.length, heardOnB.length];
    const slow = await a.sequelize.transaction();
    await channelA().publish(day(28), slow); // given the lower id
    await publishOnA(day(29)); // given the higher id, committed first
    await until(() => heardOnB.length > fromB);
    await twoPolls();
    expect(since(heardOnB, fromB)).toEqual([day(29)]);
    await slow.commit();
    await until(() => heardOnA.length - fromA >= 2 && heardOnB.length - fromB >= 2);
    await twoPolls();
    expect(since(heardOnA, fromA)).toEqual([day(29), day(28)]);
    expect(since(heardOnB, fromB)).toEqual([day(29), day(28)]);
  });

  it('relays nothing of a write that rolls back', async () => {
    const [fromA, fromB, before] = [heardOnA.length, heardOnB.length, await rows()];
    await expect(
      a.sequelize.transaction(async (t) => {
        await channelA().publish(day(20), t);
        throw new Error('refused after its event was written');
      }),
    ).rejects.toThrow('refused after');
    await twoPolls();
    expect(await rows()).toBe(before);
    expect([since(heardOnA, fromA), since(heardOnB, fromB)]).toEqual([[], []]);
    // The next write is heard as usual.
    await publishOnA(day(21));
    await until(() => heardOnB.length > fromB);
    expect(since(heardOnB, fromB)).toEqual([day(21)]);
  });

  it('loses nothing when a read of the events fails: the next one reads from where it stopped', async () => {
    const fromB = heardOnB.length;
    const repo = b.get(CounterEventsRepository);
    const real = repo.since.bind(repo);
    let failed = 0;
    const reads = jest.spyOn(repo, 'since').mockImplementation((...args) => {
      if (failed < 3) {
        failed++;
        return Promise.reject(new Error('connect ECONNREFUSED 127.0.0.1:3306'));
      }
      return real(...args);
    });
    const warned = jest.spyOn(Logger.prototype, 'warn').mockImplementation(() => undefined);
    try {
      await publishOnA(day(12));
      await publishOnA(day(13));
      await until(() => heardOnB.length - fromB >= 2);
      expect(failed).toBe(3);
      await twoPolls();
      expect(since(heardOnB, fromB)).toEqual([day(12), day(13)]);
      // Said once in the log, not at every failed read.
      expect(warned.mock.calls.filter(([m]) => String(m).startsWith('Could not read the counter’s events'))).toHaveLength(1);
    } finally {
      reads.mockRestore();
      warned.mockRestore();
    }
  });

  it('stops looking for missing ids once the ones above them were read SETTLE_MS ago, so each read stays small', async () => {
    await publishOnA(day(14));
    await until(() => JSON.stringify(heardOnB.at(-1)) === JSON.stringify(day(14)));
    const repo = b.get(CounterEventsRepository);
    const reads = jest.spyOn(repo, 'since');
    const now = Date.now();
    const later = jest.spyOn(Date, 'now').mockImplementation(() => now + SETTLE_MS + 1000);
    try {
      await twoPolls();
      const [{ newest }] = await a.sequelize.query<{ newest: number }>('SELECT MAX(id) AS newest FROM counter_events', {
        type: QueryTypes.SELECT,
      });
      const [after, heard] = reads.mock.calls.at(-1)!;
      expect({ after, heard }).toEqual({ after: Number(newest), heard: [] });
    } finally {
      later.mockRestore();
      reads.mockRestore();
    }
  });

  it('gives a stream opened later only what is written after it opened', async () => {
    await publishOnA(day(10));
    const later: CounterEvent[] = [];
    const events = b.get(CounterEvents);
    // The first stream of a fresh start of b's reader: the events already written are not repeated.
    stopB();
    stopB = await events.subscribe((e) => later.push(e));
    await twoPolls();
    expect(later).toEqual([]);
    await publishOnA(day(11));
    await until(() => later.length > 0);
    await twoPolls();
    expect(later).toEqual([day(11)]);
  });

  it('prunes events older than an hour, keeping the newer ones', async () => {
    await a.sequelize.query(
      'INSERT INTO counter_events (body, created_at) VALUES (\'{"type":"display-changed","date":"2026-01-01"}\', NOW(3) - INTERVAL 2 HOUR)',
    );
    const before = await rows();
    await channelA().prune();
    expect(await rows()).toBe(before - 1);
    const [{ oldest }] = await a.sequelize.query<{ oldest: number }>(
      'SELECT TIMESTAMPDIFF(SECOND, MIN(created_at), NOW(3)) AS oldest FROM counter_events',
      { type: QueryTypes.SELECT },
    );
    expect(Number(oldest)).toBeLessThan(3600);
    expect(SETTLE_MS).toBeLessThan(3600_000);
  });
});
