import { Global, Injectable, Module } from '@nestjs/common';

/**
 * The time as the mail sender and the account links see it: one instance for the whole app, so a
 * test moves it forward (`app.get(Clock).set(...)`) instead of waiting for a link to expire or a
 * retry to come due.
 */
@Injectable()
export class Clock {
  private offsetMs = 0;

  now(): Date {
    return new Date(Date.now() + this.offsetMs);
  }

  /** Moves this app's time by `ms` (tests only). */
  advance(ms: number): void {
    this.offsetMs += ms;
  }

  /** Back to the machine's time. */
  reset(): void {
    this.offsetMs = 0;
  }
}

@Global()
@Module({ providers: [Clock], exports: [Clock] })
export class ClockModule {}
