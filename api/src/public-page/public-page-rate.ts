import { Injectable } from '@nestjs/common';

/** Pages one address may ask for in a minute: far more than a person reading, few enough that a scraper is slowed. */
export const PAGES_PER_MINUTE = 60;
const WINDOW_MS = 60_000;

/**
 * A fixed one-minute window of page requests per address, in memory (one instance; several
 * behind a balancer would each count their own). Windows past their minute are dropped as new
 * ones open, so the map holds at most the addresses of the last minute.
 */
@Injectable()
export class PublicPageRate {
  private readonly windows = new Map<string, { start: number; count: number }>();

  /** Counts one request from the address; false once it is past the limit for this minute. */
  take(address: string, now = Date.now()): boolean {
    if (this.windows.size > 10_000) for (const [key, w] of this.windows) if (now - w.start >= WINDOW_MS) this.windows.delete(key);
    const current = this.windows.get(address);
    if (!current || now - current.start >= WINDOW_MS) {
      this.windows.set(address, { start: now, count: 1 });
      return true;
    }
    current.count += 1;
    return current.count <= PAGES_PER_MINUTE;
  }
}
