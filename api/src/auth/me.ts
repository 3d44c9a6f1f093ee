import type { Me, Role } from '@crumbproof/shared';
import type { KitchenRoleRow } from '../kitchen/kitchen-roles.repository';

/**
 * The signed-in person as the app is told: their kitchens with their role at each, and the kitchen
 * this answer is for with their role there (the one the request named, or their only one; none when
 * they work in several and named none). Before any kitchen is set up, the role they were created with.
 */
export function meOf(
  user: { id: number; email: string; name: string; role: Role },
  kitchens: readonly KitchenRoleRow[],
  kitchenId: number | null = kitchens.length === 1 ? kitchens[0].siteId : null,
): Me {
  const at = kitchens.find((k) => k.siteId === kitchenId);
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: at?.role ?? user.role,
    kitchen: at?.siteId ?? null,
    kitchens: kitchens.map((k) => ({ id: k.siteId, code: k.code, name: k.name, role: k.role })),
  };
}
