import { CanActivate, ExecutionContext, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import type { FastifyReply } from 'fastify';
import type { SessionUser } from './jwt.strategy';
import { SessionTokens } from './session-tokens';
import { AppError } from '../common/app-error';
import { isDatabaseUnavailable } from '../common/database-unavailable';
import { IS_PUBLIC, Roles } from '../common/roles.decorator';
import type { AuthUser } from '../common/current-user.decorator';

/**
 * Every route needs a running session unless it is @Public (see JwtStrategy). A session past
 * half its idle life is renewed on use, so someone working through a shift stays signed in while
 * an idle one expires; no renewal goes past the session's absolute end (SESSION_MAX_HOURS).
 */
@Injectable()
export class SessionGuard extends AuthGuard('jwt') implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly tokens: SessionTokens,
  ) {
    super();
  }

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const isPublic = this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, [context.getHandler(), context.getClass()]);
    if (isPublic) return true;
    const ok = (await super.canActivate(context)) as boolean;
    if (ok) {
      const http = context.switchToHttp();
      const user = http.getRequest<{ user?: SessionUser }>().user;
      if (user) await this.tokens.renewIfOld(http.getResponse<FastifyReply>(), user.claims, user.session);
    }
    return ok;
  }

  handleRequest<T>(err: unknown, user: T): T {
    // A session that cannot be read is no session refused: the person is told the database is away, not to sign in again.
    if (isDatabaseUnavailable(err)) throw err;
    if (err || !user) throw new AppError('unauthenticated', 'Sign in to continue.');
    return user;
  }
}

/** Default deny: a signed-in user passes only where @Roles names their role. */
@Injectable()
export class RolesGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    const isPublic = this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, [context.getHandler(), context.getClass()]);
    if (isPublic) return true;
    const allowed = this.reflector.getAllAndOverride(Roles, [context.getHandler(), context.getClass()]);
    const user = context.switchToHttp().getRequest<{ user?: AuthUser }>().user;
    if (allowed && user && allowed.includes(user.role)) return true;
    throw new AppError('forbidden', 'Your role cannot do this.');
  }
}
