/** The three kinds of user in a Crumbproof kitchen. */
export const ROLES = ['manager', 'pastry-chef', 'front-of-house'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  manager: 'Manager',
  'pastry-chef': 'Pastry chef',
  'front-of-house': 'Front of house',
};

/** Roles that may change ingredients and recipes. */
export const KITCHEN_WRITERS: readonly Role[] = ['manager', 'pastry-chef'];
/** Every signed-in role may read declarations. */
export const EVERYONE: readonly Role[] = ROLES;
