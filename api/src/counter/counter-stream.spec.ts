import { EventEmitter } from 'node:events';
import type { FastifyReply } from 'fastify';
import type { KitchenService } from '../kitchen/kitchen.service';
import { CounterEvents } from './counter-events';
import { CounterStream, eventText, HEARTBEAT_MS } from './counter-stream';

/** A response that keeps what is written to it, as the raw Node response of a hijacked reply. */
class Written extends EventEmitter {
  text = '';
  status = 0;
  headers: Record<string, unknown> = {};
  writableEnded = false;
  destroyed = false;
  setHeader(name: string, value: unknown) {
    this.headers[name.toLowerCase()] = value;
  }
  writeHead(status: number, headers: Record<string, string>) {
    this.status = status;
    for (const [name, value] of Object.entries(headers)) this.setHeader(name, value);
  }
  write(chunk: string) {
    this.text += chunk;
    return true;
  }
  end() {
    this.writableEnded = true;
  }
}

function reply(raw: Written, headers: Record<string, string> = {}) {
  return { raw, hijack: () => undefined, getHeaders: () => headers } as unknown as FastifyReply;
}

describe('an events stream of the counter (server-sent events, WHATWG HTML Living Standard)', () => {
  const kitchen = { current: () => Promise.resolve({ id: 1 }) } as unknown as KitchenService;
  beforeEach(() => jest.useFakeTimers());
  afterEach(() => jest.useRealTimers());

  it('writes each event as its type and its data, and a heartbeat comment every 15 s until the client goes', async () => {
    const events = new CounterEvents();
    const raw = new Written();
    await new CounterStream(events, kitchen).open(reply(raw, { 'x-content-type-options': 'nosniff' }));
    expect(raw.status).toBe(200);
    expect(raw.headers['content-type']).toBe('text/event-stream; charset=utf-8');
    // The headers set on the reply before (here, a security header) go out with the stream.
    expect(raw.headers['x-content-type-options']).toBe('nosniff');

    events.deliver({ type: 'declarations-changed', products: ['vegan-brownie'] });
    expect(raw.text).toContain('event: declarations-changed\ndata: {"type":"declarations-changed","products":["vegan-brownie"]}\n\n');

    const before = raw.text.length;
    jest.advanceTimersByTime(HEARTBEAT_MS - 1);
    expect(raw.text.length).toBe(before);
    jest.advanceTimersByTime(1);
    expect(raw.text.slice(before)).toBe(': heartbeat\n\n');
    jest.advanceTimersByTime(HEARTBEAT_MS);
    expect(raw.text.slice(before)).toBe(': heartbeat\n\n: heartbeat\n\n');

    // The client goes: no more heartbeats, no more events, and the stream stops listening.
    raw.emit('close');
    const closed = raw.text.length;
    jest.advanceTimersByTime(HEARTBEAT_MS * 3);
    events.deliver({ type: 'display-changed', date: '2026-12-02' });
    expect(raw.text.length).toBe(closed);
    expect(events.listening).toBe(false);
  });

  it('writes the events of its own kitchen’s counters and those for every kitchen, never another kitchen’s', async () => {
    const events = new CounterEvents();
    const raw = new Written();
    await new CounterStream(events, kitchen).open(reply(raw));
    events.deliver({ type: 'question-asked', question: 3, product: 'strawberry-tart' }, 2);
    events.deliver({ type: 'display-changed', date: '2026-12-02' }, 2);
    expect(raw.text).not.toContain('event:');
    events.deliver({ type: 'question-asked', question: 4, product: 'vegan-brownie' }, 1);
    events.deliver({ type: 'declarations-changed', products: ['vegan-brownie'] }, null);
    expect(raw.text.match(/^event: .*$/gm)).toEqual(['event: question-asked', 'event: declarations-changed']);
    expect(raw.text).toContain('"question":4');
    raw.emit('close');
  });

  it('ends every open stream when the API shuts down, so the server can close', async () => {
    const events = new CounterEvents();
    const stream = new CounterStream(events, kitchen);
    const [a, b] = [new Written(), new Written()];
    await stream.open(reply(a));
    await stream.open(reply(b));
    expect(events.listening).toBe(true);
    stream.onModuleDestroy();
    expect([a.writableEnded, b.writableEnded, events.listening]).toEqual([true, true, false]);
  });

  it('opens no stream when there is no kitchen yet', async () => {
    const events = new CounterEvents();
    const none = { current: () => Promise.reject(new Error('No kitchen is set up yet.')) } as unknown as KitchenService;
    const raw = new Written();
    await expect(new CounterStream(events, none).open(reply(raw))).rejects.toThrow('No kitchen');
    expect([raw.status, raw.text, events.listening]).toEqual([0, '', false]);
  });

  it('opens no stream, and listens to nothing, when its events cannot be read (the database away)', async () => {
    const events = new CounterEvents();
    let stopped = 0;
    events.feedFrom({ started: () => Promise.reject(new Error('connect ECONNREFUSED')), stopped: () => stopped++ });
    const raw = new Written();
    await expect(new CounterStream(events, kitchen).open(reply(raw))).rejects.toThrow('ECONNREFUSED');
    expect([raw.status, raw.text, events.listening, stopped]).toEqual([0, '', false, 1]);
  });

  it('starts its source with the first stream and stops it with the last', async () => {
    const events = new CounterEvents();
    const told: string[] = [];
    events.feedFrom({
      started: () => {
        told.push('started');
        return Promise.resolve();
      },
      stopped: () => told.push('stopped'),
    });
    const stream = new CounterStream(events, kitchen);
    const [a, b] = [new Written(), new Written()];
    await stream.open(reply(a));
    await stream.open(reply(b));
    a.emit('close');
    expect(told).toEqual(['started']);
    b.emit('close');
    expect(told).toEqual(['started', 'stopped']);
    await stream.open(reply(new Written()));
    expect(told).toEqual(['started', 'stopped', 'started']);
  });

  it('writes an event as one block of the text/event-stream format', () => {
    expect(eventText({ type: 'question-answered', question: 7, product: 'strawberry-tart' })).toBe(
      'event: question-answered\ndata: {"type":"question-answered","question":7,"product":"strawberry-tart"}\n\n',
    );
  });
});
