import { Injectable, type OnModuleDestroy } from '@nestjs/common';
import type { CounterEvent } from '@crumbproof/shared';
import type { FastifyReply } from 'fastify';
import { KitchenService } from '../kitchen/kitchen.service';
import { CounterEvents } from './counter-events';

/** A comment line every 15 s keeps proxies and the browser from taking a quiet stream for a dead one. */
export const HEARTBEAT_MS = 15_000;
/** How long a browser waits before it reconnects a dropped stream (EventSource's retry field). */
const RETRY_MS = 2_000;

/** One event in the text/event-stream format (WHATWG HTML Living Standard, "Server-sent events"). */
export function eventText(event: CounterEvent): string {
  return `event: ${event.type}\ndata: ${JSON.stringify(event)}\n\n`;
}

/** Open server-sent event streams of the counter, each fed from CounterEvents (every instance's events, CounterChannel) until its client goes. */
@Injectable()
export class CounterStream implements OnModuleDestroy {
  private readonly streams = new Set<() => void>();

  constructor(
    private readonly events: CounterEvents,
    private readonly kitchen: KitchenService,
  ) {}

  /**
   * Opens a stream on the request's connection for the request's kitchen (named by the header or,
   * as an EventSource sends no header, `?kitchen=`): it hears the events of that kitchen's counters
   * and those for every kitchen. Refused, as any route is, when there is no kitchen yet.
   */
  async open(reply: FastifyReply): Promise<void> {
    const site = await this.kitchen.current();
    // Listening first, so the stream hears every event written once it says it is connected (one
    // written before then is seen by the read the client starts once connected).
    const raw = reply.raw;
    let connected = false;
    const unsubscribe = await this.events.subscribe((event, kitchen) => {
      if (connected && (kitchen === null || kitchen === site.id)) raw.write(eventText(event));
    });
    reply.hijack();
    // The headers hooks set on the reply (security headers, a renewed session cookie) go out too.
    for (const [name, value] of Object.entries(reply.getHeaders())) if (value !== undefined) raw.setHeader(name, value);
    raw.writeHead(200, {
      'content-type': 'text/event-stream; charset=utf-8',
      'cache-control': 'no-store',
      connection: 'keep-alive',
      'x-accel-buffering': 'no',
    });
    raw.write(`retry: ${RETRY_MS}\n: connected\n\n`);
    connected = true;
    const heartbeat = setInterval(() => raw.write(': heartbeat\n\n'), HEARTBEAT_MS);
    const close = () => {
      clearInterval(heartbeat);
      unsubscribe();
      this.streams.delete(close);
      if (!raw.writableEnded && !raw.destroyed) raw.end();
    };
    this.streams.add(close);
    // The response closes when the client goes (the request's own close comes once its body is read).
    raw.on('close', close);
    raw.on('error', close);
    // A client gone before the stream was set up.
    if (raw.destroyed) close();
  }

  /** Ends every open stream, so the server can close (an open stream is never idle). */
  onModuleDestroy() {
    for (const close of [...this.streams]) close();
  }
}
