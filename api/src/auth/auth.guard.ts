import { CanActivate, ExecutionContext, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import type { FastifyReply, FastifyRequest } from 'fastify';
import { KITCHEN_HEADER } from '@crumbproof/shared';
import type { SessionUser } from './jwt.strategy';
import { SessionTokens } from './session-tokens';
import { AppError } from '../common/app-error';
import { isDatabaseUnavailable } from '../common/database-unavailable';
import { ANY_KITCHEN, IS_PUBLIC, Roles } from '../common/roles.decorator';
import type { AuthUser } from '../common/current-user.decorator';
import { KitchenRolesRepository, type KitchenRoleRow } from '../kitchen/kitchen-roles.repository';
import { SiteRepository } from '../kitchen/site.repository';

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

/**
 * The kitchen a request names: its X-Crumbproof-Kitchen header, or its `kitchen` query parameter
 * where a header cannot be sent (an events stream, a PDF opened in a new tab). Undefined when it names none.
 */
export function kitchenNamed(request: FastifyRequest): string | undefined {
  const header = request.headers[KITCHEN_HEADER];
  const fromHeader = Array.isArray(header) ? header[0] : header;
  const query = (request.query ?? {}) as Record<string, unknown>;
  const fromQuery = typeof query.kitchen === 'string' && query.kitchen !== '' ? query.kitchen.trim() : undefined;
  // Taken off the query, so a route's own query schema never sees it as a field of its own.
  if ('kitchen' in query) delete query.kitchen;
  return fromHeader !== undefined && fromHeader !== '' ? fromHeader.trim() : fromQuery;
}

/**
 * Default deny, per kitchen: a signed-in user passes only where @Roles names their role at the
 * kitchen the request is for. That kitchen is the one the request names, which must be one the
 * person has a role in, or the person's only one; a person of several kitchens must name one
 * (except on @AnyKitchen routes). Before any kitchen is set up, the role a person was created
 * with stands (the first manager imports the first book). The kitchen and the role there are set
 * on the request's user for the handlers and the audit trail.
 */
@Injectable()
export class RolesGuard implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly kitchenRoles: KitchenRolesRepository,
    private readonly sites: SiteRepository,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const targets = [context.getHandler(), context.getClass()];
    if (this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, targets)) return true;
    const allowed = this.reflector.getAllAndOverride(Roles, targets);
    const request = context.switchToHttp().getRequest<FastifyRequest & { user?: AuthUser }>();
    const user = request.user;
    if (!allowed || !user) throw new AppError('forbidden', 'Your role cannot do this.');
    const anyKitchen = this.reflector.getAllAndOverride<boolean>(ANY_KITCHEN, targets) ?? false;
    const kitchens = await this.kitchenRoles.ofUserAtRequest(user.id);
    const at = await this.kitchenOf(kitchenNamed(request), kitchens, anyKitchen);
    user.kitchens = kitchens;
    user.kitchenId = at?.siteId ?? null;
    if (at) user.role = at.role;
    if (allowed.includes(user.role)) return true;
    throw new AppError('forbidden', at ? `Your role at ${at.name} cannot do this.` : 'Your role cannot do this.');
  }

  private async kitchenOf(
    named: string | undefined,
    kitchens: readonly KitchenRoleRow[],
    anyKitchen: boolean,
  ): Promise<KitchenRoleRow | null> {
    if (named !== undefined) {
      const at = kitchens.find((k) => String(k.siteId) === named);
      if (at) return at;
      throw new AppError(
        'forbidden',
        'You have no role at that kitchen. Ask one of its managers to add you, or choose one of your kitchens.',
      );
    }
    if (kitchens.length === 1) return kitchens[0];
    if (kitchens.length > 1) {
      if (anyKitchen) return null;
      throw new AppError(
        'kitchen-required',
        `You work in ${kitchens.length} kitchens (${kitchens.map((k) => k.name).join(', ')}): choose the one this is for.`,
      );
    }
    if (!anyKitchen && (await this.sites.first()))
      throw new AppError('forbidden', 'You have no role at any kitchen yet. Ask a manager to add you to theirs.');
    return null;
  }
}
