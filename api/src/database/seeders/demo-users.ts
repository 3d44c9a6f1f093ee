import type { Role } from '@crumbproof/shared';

/**
 * The demo kitchen's staff. Every demo account shares one password, published in the README and
 * printed by npm start, so they are seeded only in demo mode (see isDemoKitchen) and refused at
 * sign-in outside it.
 */
export const DEMO_PASSWORD = 'crumbproof-demo';

export const DEMO_USERS: { email: string; name: string; role: Role }[] = [
  { email: 'manager@example.com', name: 'Maren Holloway', role: 'manager' },
  { email: 'chef@example.com', name: 'Tobiah Quill', role: 'pastry-chef' },
  { email: 'counter@example.com', name: 'Priya Santangelo', role: 'front-of-house' },
];

export const DEMO_SITE_ADDRESS = '14 Tannery Row, Wexcombe (an invented address)';
