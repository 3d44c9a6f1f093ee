import { CanActivate, ExecutionContext, Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { Reflector } from '@nestjs/core';
import { JwtService } from '@nestjs/jwt';
import { AuthGuard } from '@nestjs/passport';
import type { FastifyReply } from 'fastify';
import { setSessionCookie } from '../auth/session-cookie';
import type { AppConfig } from '../config/config';
import { AppError } from './app-error';
import { IS_PUBLIC, Roles } from './roles.decorator';
import type { AuthUser } from './current-user.decorator';

/**
 * Every route needs a valid session unless it is @Public. A session past half its life is
 * renewed on use, so someone working through a shift stays signed in while an idle one expires.
 */
@Injectable()
export class SessionGuard extends AuthGuard('jwt') implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly jwt: JwtService,
    private readonly config: ConfigService<AppConfig, true>,
  ) {
    super();
  }

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const isPublic = this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, [context.getHandler(), context.getClass()]);
    if (isPublic) return true;
    const ok = (await super.canActivate(context)) as boolean;
    if (ok) await this.renewIfOld(context);
    return ok;
  }

  handleRequest<T>(err: unknown, user: T): T {
    if (err || !user) throw new AppError('unauthenticated', 'Sign in to continue.');
    return user;
  }

  private async renewIfOld(context: ExecutionContext) {
    const http = context.switchToHttp();
    const user = http.getRequest<{ user?: AuthUser & { issuedAt?: number } }>().user;
    if (!user?.issuedAt) return;
    const lifetime = this.config.get('SESSION_MINUTES', { infer: true }) * 60;
    const age = Math.floor(Date.now() / 1000) - user.issuedAt;
    if (age < lifetime / 2) return;
    const token = await this.jwt.signAsync({ sub: user.id });
    setSessionCookie(http.getResponse<FastifyReply>(), token, lifetime, this.config.get('COOKIE_SECURE', { infer: true }));
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
