import { ROLE_LABELS, ROLES, type Role } from '@crumbproof/shared';

/** Every page of the workbench, in the order the navigation shows them. */
export const PAGES = {
  ingredients: { path: '/ingredients', label: 'Ingredients' },
  today: { path: '/today', label: 'Today' },
  recipes: { path: '/recipes', label: 'Recipes' },
  counter: { path: '/counter', label: 'Counter' },
  labels: { path: '/labels', label: 'Labels' },
  approvals: { path: '/approvals', label: 'Approvals' },
  audit: { path: '/audit', label: 'Audit' },
  kitchen: { path: '/kitchen', label: 'Kitchen' },
  users: { path: '/users', label: 'Users' },
  mail: { path: '/mail', label: 'Mail' },
} as const satisfies Record<string, { path: string; label: string }>;

export type PageKey = keyof typeof PAGES;

/**
 * The one place that says which role may open which page. The navigation, the first page
 * after sign-in and the refused page all read it.
 */
export const PAGES_BY_ROLE: Record<Role, readonly PageKey[]> = {
  manager: ['ingredients', 'today', 'recipes', 'counter', 'labels', 'approvals', 'audit', 'kitchen', 'users', 'mail'],
  'pastry-chef': ['ingredients', 'today', 'recipes', 'counter', 'labels', 'approvals'],
  'front-of-house': ['counter', 'recipes'],
};

export function pagesFor(role: Role): readonly PageKey[] {
  return PAGES_BY_ROLE[role];
}

export function canOpen(role: Role, page: PageKey): boolean {
  return PAGES_BY_ROLE[role].includes(page);
}

/** Where a role lands after signing in, or on "/". */
export function firstPathFor(role: Role): string {
  const [first] = PAGES_BY_ROLE[role];
  return first ? PAGES[first].path : '/';
}

export function rolesThatCanOpen(page: PageKey): Role[] {
  return ROLES.filter((role) => canOpen(role, page));
}

/** "Manager", "Manager and Pastry chef", "Manager, Pastry chef and Front of house". */
export function describeRoles(roles: readonly Role[]): string {
  const labels = roles.map((role) => ROLE_LABELS[role]);
  if (labels.length <= 1) return labels.join('');
  return `${labels.slice(0, -1).join(', ')} and ${labels.at(-1)}`;
}

/** The page an address belongs to ("/recipes/brioche" is in Recipes), or null for one outside them. */
export function pageAt(pathname: string): PageKey | null {
  const keys = Object.keys(PAGES) as PageKey[];
  return keys.find((key) => pathname === PAGES[key].path || pathname.startsWith(`${PAGES[key].path}/`)) ?? null;
}
