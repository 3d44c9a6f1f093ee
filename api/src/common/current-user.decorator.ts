import { createParamDecorator, ExecutionContext } from '@nestjs/common';
import type { Role } from '@crumbproof/shared';

export interface AuthUser {
  id: number;
  email: string;
  name: string;
  role: Role;
  /** The session this request came with. */
  sessionId: string;
}

export const CurrentUser = createParamDecorator((_: unknown, ctx: ExecutionContext): AuthUser => {
  return ctx.switchToHttp().getRequest<{ user: AuthUser }>().user;
});
