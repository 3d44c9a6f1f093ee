import { CanActivate, ExecutionContext, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import { AppError } from './app-error';
import { IS_PUBLIC, Roles } from './roles.decorator';
import type { AuthUser } from './current-user.decorator';

/** Every route needs a valid session unless it is @Public. */
@Injectable()
export class SessionGuard extends AuthGuard('jwt') implements CanActivate {
  constructor(private readonly reflector: Reflector) {
    super();
  }

  canActivate(context: ExecutionContext) {
    const isPublic = this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, [context.getHandler(), context.getClass()]);
    if (isPublic) return true;
    return super.canActivate(context);
  }

  handleRequest<T>(err: unknown, user: T): T {
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
