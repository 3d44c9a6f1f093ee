import { Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import type { FastifyRequest } from 'fastify';
import type { AppConfig } from '../config/config';
import type { AuthUser } from '../common/current-user.decorator';
import { UsersRepository } from '../users/users.repository';
import type { SessionModel } from './session.model';
import { SessionsRepository } from './sessions.repository';
import { readSessionCookie } from './session-cookie';
import { sessionKey } from './session-key';
import type { SessionClaims } from './session-tokens';

/** The signed-in user with the session and token they came with (for renewal). */
export type SessionUser = AuthUser & { claims: SessionClaims; session: SessionModel };

/**
 * Reads the session from its httpOnly cookie. A valid signature is not enough: the session row
 * must still be running, and the user's role and state come fresh from the database.
 */
@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy, 'jwt') {
  constructor(
    config: ConfigService<AppConfig, true>,
    private readonly users: UsersRepository,
    private readonly sessions: SessionsRepository,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromExtractors([(req: FastifyRequest) => readSessionCookie(req)]),
      // passport-jwt hands the key to jsonwebtoken, which takes a KeyObject (its types say string or Buffer only).
      secretOrKey: sessionKey(config.get('JWT_SECRET', { infer: true })) as unknown as Buffer,
      algorithms: ['HS256'],
      ignoreExpiration: false,
      passReqToCallback: false,
    });
  }

  async validate(claims: SessionClaims): Promise<SessionUser | null> {
    if (typeof claims.sid !== 'string' || typeof claims.sub !== 'number') return null;
    const session = await this.sessions.findLive(claims.sid, new Date());
    if (!session || session.userId !== claims.sub) return null;
    const row = await this.users.findById(claims.sub);
    if (!row || !row.active) return null;
    return { id: row.id, email: row.email, name: row.name, role: row.role, sessionId: session.id, claims, session };
  }
}
