import { Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import type { FastifyRequest } from 'fastify';
import type { AppConfig } from '../config/config';
import type { AuthUser } from '../common/current-user.decorator';
import { UsersRepository } from '../users/users.repository';
import { readSessionCookie } from './session-cookie';

export interface SessionClaims {
  sub: number;
  iat?: number;
  exp?: number;
}

/** Reads the session from its httpOnly cookie; the user's role and state come fresh from the database. */
@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy, 'jwt') {
  constructor(
    config: ConfigService<AppConfig, true>,
    private readonly users: UsersRepository,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromExtractors([(req: FastifyRequest) => readSessionCookie(req)]),
      secretOrKey: config.get('JWT_SECRET', { infer: true }),
      algorithms: ['HS256'],
      ignoreExpiration: false,
      passReqToCallback: false,
    });
  }

  async validate(claims: SessionClaims): Promise<(AuthUser & { issuedAt?: number }) | null> {
    const row = await this.users.findById(claims.sub);
    if (!row || !row.active) return null;
    return { id: row.id, email: row.email, name: row.name, role: row.role, issuedAt: claims.iat };
  }
}
