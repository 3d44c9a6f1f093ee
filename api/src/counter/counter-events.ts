import { Injectable } from '@nestjs/common';
import type { CounterEvent } from '@crumbproof/shared';

export type CounterEventListener = (event: CounterEvent) => void;

/**
 * The counter's events within this process: every open events stream subscribes, and the
 * kitchen's writes publish. One instance of the API is enough for one kitchen today; several
 * instances behind a load balancer will need a shared channel (the database, or a message broker)
 * so that a write on one reaches the streams open on the others.
 */
@Injectable()
export class CounterEvents {
  private readonly listeners = new Set<CounterEventListener>();

  /** Listens until the returned function is called. */
  subscribe(listener: CounterEventListener): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /** Whether any stream is open: with none, there is no one to tell. */
  get listening(): boolean {
    return this.listeners.size > 0;
  }

  publish(event: CounterEvent): void {
    for (const listener of this.listeners) listener(event);
  }
}
