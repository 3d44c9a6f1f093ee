import { SetMetadata } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Role } from '@crumbproof/shared';

/** The roles that may call a route. A route with neither @Roles nor @Public is refused to everyone. */
export const Roles = Reflector.createDecorator<readonly Role[]>();

export const IS_PUBLIC = 'crumbproof:public';
/** A route anyone may call without signing in (sign-in, health). */
export const Public = () => SetMetadata(IS_PUBLIC, true);
