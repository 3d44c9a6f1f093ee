import type { CounterEvent } from '@crumbproof/shared';
import { act } from '@testing-library/react';
import { vi } from 'vitest';

/** An EventSource the test drives: open it, push an event, drop it. jsdom has none. */
export class FakeEventSource extends EventTarget {
  static readonly CONNECTING = 0;
  static readonly OPEN = 1;
  static readonly CLOSED = 2;
  static opened: FakeEventSource[] = [];

  readonly url: string;
  readyState = FakeEventSource.CONNECTING;

  constructor(url: string | URL) {
    super();
    this.url = String(url);
    FakeEventSource.opened.push(this);
  }

  close() {
    this.readyState = FakeEventSource.CLOSED;
  }

  /** The stream as the server answers it. */
  open() {
    act(() => {
      this.readyState = FakeEventSource.OPEN;
      this.dispatchEvent(new Event('open'));
    });
  }

  push(event: CounterEvent) {
    act(() => {
      this.dispatchEvent(new MessageEvent(event.type, { data: JSON.stringify(event) }));
    });
  }

  /** The connection dropped; the browser will try again by itself (CONNECTING), or not (CLOSED). */
  drop(readyState: number = FakeEventSource.CONNECTING) {
    act(() => {
      this.readyState = readyState;
      this.dispatchEvent(new Event('error'));
    });
  }

  /** The one stream still open. */
  static current(): FakeEventSource {
    const live = FakeEventSource.opened.filter((s) => s.readyState !== FakeEventSource.CLOSED);
    const last = live[live.length - 1];
    if (!last) throw new Error('No events stream is open.');
    return last;
  }
}

export function stubEventSource() {
  FakeEventSource.opened = [];
  vi.stubGlobal('EventSource', FakeEventSource);
}
