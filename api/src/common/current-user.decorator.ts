import { createParamDecorator, ExecutionContext } from '@nestjs/common';
import type { Role } from '@crumbproof/shared';

/** A kitchen a person works in, with their role there (kitchen_roles, read by KitchenRolesRepository). */
export interface KitchenRoleRow {
  siteId: number;
  code: string | null;
  name: string;
  role: Role;
}

export interface AuthUser {
  id: number;
  email: string;
  name: string;
  /** The person's role at the request's kitchen (RolesGuard); before any kitchen is set up, the role they were created with. */
  role: Role;
  /** The kitchen the request is for, set by RolesGuard: the one it names, or the person's only one. */
  kitchenId?: number | null;
  /** Every kitchen the person works in, with their role there (RolesGuard). */
  kitchens?: readonly KitchenRoleRow[];
  /** The session this request came with. */
  sessionId: string;
}

export const CurrentUser = createParamDecorator((_: unknown, ctx: ExecutionContext): AuthUser => {
  return ctx.switchToHttp().getRequest<{ user: AuthUser }>().user;
});
