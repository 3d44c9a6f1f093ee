import { Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { JwtService } from '@nestjs/jwt';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import type { FastifyRequest } from 'fastify';
import type { AppConfig } from '../config/config';
import type { AuthUser } from '../common/current-user.decorator';
import { UsersRepository } from '../users/users.repository';
import { SessionsRepository, type LiveSession } from './sessions.repository';
import { readSessionCookie } from './session-cookie';
import { sessionKey } from './session-key';
import type { SessionClaims } from './session-tokens';

/** How many verified tokens are kept (past it, all are dropped and verified again). */
const VERIFIED_AT_MOST = 10_000;

/** What passport gives a strategy for the request it authenticates. */
interface PassportOutcome {
  success(user: unknown): void;
  fail(info?: unknown): void;
  error(err: unknown): void;
}

/** The signed-in user with the session and token they came with (for renewal). */
export type SessionUser = AuthUser & { claims: SessionClaims; session: LiveSession };

/**
 * Reads the session from its httpOnly cookie. A valid signature is not enough: the session row
 * must still be running, and the user must be active, with their role and state as the database
 * has them: both read through this instance's copies (SessionsRepository.findLive,
 * UsersRepository.forSession), which a sign-out, password change, deactivation or role change
 * drops at once here and within CHANGE_STALE_MS (1 s) on every other instance (ChangeFeed).
 */
@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy, 'jwt') {
  /**
   * Each token already verified, with its claims: the same bytes under the same key verify the same
   * way until the token expires, so a token sent again is not decoded and its HMAC not computed
   * again; its expiry is still checked at every request, as jsonwebtoken checks it.
   */
  private readonly verified = new Map<string, SessionClaims>();

  constructor(
    config: ConfigService<AppConfig, true>,
    private readonly users: UsersRepository,
    private readonly sessions: SessionsRepository,
    private readonly jwt: JwtService,
  ) {
    // passport-jwt's constructor refuses to build without an extractor and a key. They say what
    // `authenticate` below does itself (the same cookie, the same key, HS256 only, expiry checked),
    // so that it can keep each verified token; passport-jwt's own authenticate is never called.
    super({
      jwtFromRequest: ExtractJwt.fromExtractors([(req: FastifyRequest) => readSessionCookie(req)]),
      // passport-jwt hands the key to jsonwebtoken, which takes a KeyObject (its types say string or Buffer only).
      secretOrKey: sessionKey(config.get('JWT_SECRET', { infer: true })) as unknown as Buffer,
      algorithms: ['HS256'],
      ignoreExpiration: false,
      passReqToCallback: false,
    });
  }

  /** As passport-jwt authenticates (the token from the cookie, verified, then validate), with each token's verification kept. */
  authenticate(req: Parameters<Strategy['authenticate']>[0]): void {
    const outcome = this as unknown as PassportOutcome;
    // Passport is handed the Fastify request (AuthGuard gives it what the route was called with).
    const token = readSessionCookie(req as unknown as FastifyRequest);
    if (!token) return outcome.fail(new Error('No auth token'));
    const claims = this.verify(token);
    if (!claims) return outcome.fail(new Error('The session token is not valid'));
    this.validate(claims).then(
      (user) => (user ? outcome.success(user) : outcome.fail()),
      (err: unknown) => outcome.error(err),
    );
  }

  private verify(token: string): SessionClaims | null {
    const kept = this.verified.get(token);
    let claims = kept;
    if (!claims) {
      try {
        claims = this.jwt.verify<SessionClaims>(token, { algorithms: ['HS256'] });
      } catch {
        return null;
      }
    }
    // jsonwebtoken's own test: expired once the clock's whole seconds reach exp.
    if (typeof claims.exp === 'number' && Math.floor(Date.now() / 1000) >= claims.exp) {
      this.verified.delete(token);
      return null;
    }
    if (!kept) {
      if (this.verified.size >= VERIFIED_AT_MOST) this.verified.clear();
      this.verified.set(token, claims);
    }
    return claims;
  }

  async validate(claims: SessionClaims): Promise<SessionUser | null> {
    if (typeof claims.sid !== 'string' || typeof claims.sub !== 'number') return null;
    const session = await this.sessions.findLive(claims.sid, new Date());
    if (!session || session.userId !== claims.sub) return null;
    const row = await this.users.forSession(claims.sub);
    if (!row || !row.active) return null;
    return { id: row.id, email: row.email, name: row.name, role: row.role, sessionId: session.id, claims, session };
  }
}
