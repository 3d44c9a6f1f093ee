import { Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { JwtService } from '@nestjs/jwt';
import type { FastifyReply } from 'fastify';
import { sessionCookieSecure, type AppConfig } from '../config/config';
import { SessionsRepository, type LiveSession } from './sessions.repository';
import { clearSessionCookie, setSessionCookie } from './session-cookie';

/** What the session cookie's token says: whose it is and which session row it belongs to. */
export interface SessionClaims {
  sub: number;
  sid: string;
  iat?: number;
  exp?: number;
}

/**
 * Starts, renews and ends sessions, and writes the cookie. A token never lives longer than its
 * session row's idle end, and a renewal never moves that past the session's absolute end.
 */
@Injectable()
export class SessionTokens {
  constructor(
    private readonly jwt: JwtService,
    private readonly sessions: SessionsRepository,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  private get idleMs() {
    return this.config.get('SESSION_MINUTES', { infer: true }) * 60_000;
  }

  get secure() {
    return sessionCookieSecure(this.config);
  }

  /** A new session for a user who has just proved who they are; sets the cookie. */
  async start(userId: number, reply: FastifyReply, now = new Date()) {
    const maxMs = this.config.get('SESSION_MAX_HOURS', { infer: true }) * 3_600_000;
    const session = await this.sessions.start(userId, now, this.idleMs, maxMs);
    await this.write(reply, session.userId, session.id, session.idleExpiresAt, now);
  }

  /** Past half its idle life, a session's idle end moves on (never past its absolute end) and the cookie is renewed. */
  async renewIfOld(reply: FastifyReply, claims: { sub: number; sid: string; iat?: number }, session: LiveSession, now = new Date()) {
    if (claims.iat === undefined) return;
    if (now.getTime() - claims.iat * 1000 < this.idleMs / 2) return;
    const idleExpiresAt = new Date(Math.min(now.getTime() + this.idleMs, session.expiresAt.getTime()));
    if (idleExpiresAt.getTime() <= session.idleExpiresAt.getTime()) return;
    if (!(await this.sessions.renew(session.id, now, idleExpiresAt))) return;
    await this.write(reply, claims.sub, session.id, idleExpiresAt, now);
  }

  /** Ends the session the cookie names (even an expired one) and clears the cookie; the session's user, or null when it named none. */
  async end(token: string | null, reply: FastifyReply): Promise<number | null> {
    let userId: number | null = null;
    if (token) {
      const claims = await this.jwt.verifyAsync<SessionClaims>(token, { ignoreExpiration: true }).catch(() => null);
      if (claims?.sid) {
        await this.sessions.end(claims.sid, 'signed-out');
        userId = typeof claims.sub === 'number' ? claims.sub : null;
      }
    }
    clearSessionCookie(reply, this.secure);
    return userId;
  }

  private async write(reply: FastifyReply, userId: number, sid: string, until: Date, now: Date) {
    const seconds = Math.max(1, Math.floor((until.getTime() - now.getTime()) / 1000));
    const token = await this.jwt.signAsync({ sub: userId, sid } satisfies SessionClaims, { expiresIn: seconds });
    setSessionCookie(reply, token, seconds, this.secure);
  }
}
