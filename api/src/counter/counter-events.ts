import { Injectable } from '@nestjs/common';
import type { CounterEvent } from '@crumbproof/shared';

/** Hears each event with the kitchen it is for (null: every kitchen). */
export type CounterEventListener = (event: CounterEvent, kitchen: number | null) => void;

/** What a source of events is told: the first listener came (it answers once it delivers), or the last one went. */
export interface CounterEventSource {
  started(): Promise<void>;
  stopped(): void;
}

/**
 * The counter's events within this instance: every open events stream subscribes, and the
 * source (CounterChannel, which reads the events every instance writes to the database) delivers
 * to them. The source runs only while a stream is open.
 */
@Injectable()
export class CounterEvents {
  private readonly listeners = new Set<CounterEventListener>();
  private source: CounterEventSource | null = null;
  private ready: Promise<void> | null = null;

  /** The one source of this instance's events. */
  feedFrom(source: CounterEventSource): void {
    this.source = source;
  }

  /**
   * Listens until the returned function is called; answers once the source delivers every event
   * written from now on. Refused, listening to nothing, when the source cannot start (the database
   * cannot be reached).
   */
  async subscribe(listener: CounterEventListener): Promise<() => void> {
    this.listeners.add(listener);
    const unsubscribe = () => {
      if (!this.listeners.delete(listener) || this.listeners.size > 0) return;
      this.ready = null;
      this.source?.stopped();
    };
    try {
      await (this.ready ??= this.source ? this.source.started() : Promise.resolve());
    } catch (err) {
      if (this.ready) this.ready = null;
      unsubscribe();
      throw err;
    }
    return unsubscribe;
  }

  /** Whether any stream is open: with none, there is no one to tell. */
  get listening(): boolean {
    return this.listeners.size > 0;
  }

  /** Hands an event, for one kitchen's counters or (null) every kitchen's, to every open stream of this instance. */
  deliver(event: CounterEvent, kitchen: number | null = null): void {
    for (const listener of this.listeners) listener(event, kitchen);
  }
}
