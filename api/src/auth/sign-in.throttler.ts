import { Injectable } from '@nestjs/common';
import { ThrottlerGuard } from '@nestjs/throttler';

/**
 * Counts sign-in attempts per address and email, so that one person guessing a password is
 * slowed down without locking out colleagues on the same counter tablet.
 */
@Injectable()
export class SignInThrottlerGuard extends ThrottlerGuard {
  protected async getTracker(req: Record<string, unknown>): Promise<string> {
    const body = (req.body ?? {}) as { email?: unknown };
    const email = typeof body.email === 'string' ? body.email.trim().toLowerCase() : '';
    return `${String(req.ip)}|${email}`;
  }
}
