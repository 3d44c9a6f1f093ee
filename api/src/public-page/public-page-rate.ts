import { Injectable, Logger } from '@nestjs/common';
import { Clock } from '../common/clock';
import { PublicPageHitsRepository } from './public-page-hits.repository';

/** Pages one address may ask for in a minute: far more than a person reading, few enough that a scraper is slowed. */
export const PAGES_PER_MINUTE = 60;
export const WINDOW_MS = 60_000;

/** The start of the one-minute window a moment falls in (windows start on the minute). */
export function windowOf(now: Date): Date {
  return new Date(Math.floor(now.getTime() / WINDOW_MS) * WINDOW_MS);
}

/**
 * A fixed one-minute window of page requests per address, counted in the database so that every
 * API instance behind a balancer counts the same requests (behind N instances an address still
 * gets PAGES_PER_MINUTE). Each instance prunes the windows past their minute, at most once a minute.
 */
@Injectable()
export class PublicPageRate {
  private readonly logger = new Logger(PublicPageRate.name);
  private prunedWindow = 0;

  constructor(
    private readonly hits: PublicPageHitsRepository,
    private readonly clock: Clock,
  ) {}

  /** Counts one request from the address; false once it is past the limit for this minute. */
  async take(address: string): Promise<boolean> {
    const window = windowOf(this.clock.now());
    if (window.getTime() > this.prunedWindow) {
      this.prunedWindow = window.getTime();
      // The window before stays a minute more, for an instance whose clock runs a little behind.
      this.hits
        .prune(new Date(window.getTime() - WINDOW_MS))
        .catch((e: unknown) => this.logger.warn(`Could not prune the page counts: ${String(e)}`));
    }
    return (await this.hits.count(address.slice(0, 80), window)) <= PAGES_PER_MINUTE;
  }
}
