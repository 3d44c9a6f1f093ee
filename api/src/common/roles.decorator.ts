import { SetMetadata } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Role } from '@crumbproof/shared';

/** The roles that may call a route. A route with neither @Roles nor @Public is refused to everyone. */
export const Roles = Reflector.createDecorator<readonly Role[]>();

export const IS_PUBLIC = 'crumbproof:public';
/** A route anyone may call without signing in (sign-in, health). */
export const Public = () => SetMetadata(IS_PUBLIC, true);

export const ANY_KITCHEN = 'crumbproof:any-kitchen';
/**
 * A route about the signed-in person rather than a kitchen (who am I, which kitchens): it needs a
 * session but no kitchen chosen, so a person of several kitchens reaches it before choosing one.
 */
export const AnyKitchen = () => SetMetadata(ANY_KITCHEN, true);
