import type { Role } from '@crumbproof/shared';

/**
 * The demo's staff. Every demo account shares one password, published in the README and printed
 * by npm start, so they are seeded only in demo mode (see isDemoKitchen) and refused at sign-in
 * outside it. Every name is invented.
 */
export const DEMO_PASSWORD = 'crumbproof-demo';

/**
 * A demo person: the role they are created with, and their role at each kitchen they work in, by
 * the kitchen's id in the book (`at` left out: that role at every kitchen of the book).
 */
export interface DemoPerson {
  email: string;
  name: string;
  role: Role;
  at?: Record<string, Role>;
}

/** The one-kitchen demo's staff (demo-book.json): one of each role, each at the one kitchen. */
export const DEMO_USERS: DemoPerson[] = [
  { email: 'manager@example.com', name: 'Maren Holloway', role: 'manager' },
  { email: 'chef@example.com', name: 'Tobiah Quill', role: 'pastry-chef' },
  { email: 'counter@example.com', name: 'Priya Santangelo', role: 'front-of-house' },
];

export const DEMO_BAKEHOUSE = 'wrenfield-lane';
export const DEMO_CAFE = 'saltmarsh-cafe';

/**
 * The demo chain's staff (demo-chain-book.json): the manager and the pastry chef work at both
 * kitchens, each counter at its own, and one person manages the café and serves at the
 * bakehouse's counter, so a role is seen to be a person's role at one kitchen.
 */
export const DEMO_CHAIN_USERS: DemoPerson[] = [
  { email: 'manager@example.com', name: 'Maren Holloway', role: 'manager', at: { [DEMO_BAKEHOUSE]: 'manager', [DEMO_CAFE]: 'manager' } },
  {
    email: 'chef@example.com',
    name: 'Tobiah Quill',
    role: 'pastry-chef',
    at: { [DEMO_BAKEHOUSE]: 'pastry-chef', [DEMO_CAFE]: 'pastry-chef' },
  },
  { email: 'counter@example.com', name: 'Priya Santangelo', role: 'front-of-house', at: { [DEMO_BAKEHOUSE]: 'front-of-house' } },
  { email: 'cafe@example.com', name: 'Osei Brannock', role: 'front-of-house', at: { [DEMO_CAFE]: 'front-of-house' } },
  {
    email: 'quay@example.com',
    name: 'Ilse Marchbank',
    role: 'manager',
    at: { [DEMO_CAFE]: 'manager', [DEMO_BAKEHOUSE]: 'front-of-house' },
  },
];

export const DEMO_SITE_ADDRESS = '14 Tannery Row, Wexcombe (an invented address)';
