import { KITCHEN_HEADER, type KitchenRole, type KitchenView, type LabelSettings, type Me, type Role, type User } from '@crumbproof/shared';
import { vi } from 'vitest';

export interface MockResponse {
  status?: number;
  body?: unknown;
}

/** A function handler may answer later (a promise), to hold a response while the test looks at the page. */
type Handler = MockResponse | ((request: { body: unknown; url: string; kitchen: string | null }) => MockResponse | Promise<MockResponse>);

/** Keys are "METHOD /api/path", e.g. "POST /api/auth/sign-in". */
export type ApiHandlers = Record<string, Handler>;

export interface RecordedCall {
  method: string;
  path: string;
  body: unknown;
  credentials: RequestCredentials | undefined;
  /** The kitchen the request named in its header, or null when it named none. */
  kitchen: string | null;
  /** The `kitchen` query parameter of the address, or null. */
  kitchenParam: string | null;
}

/** The address a fetch was called with, whichever form it came in. */
export function requestUrl(input: RequestInfo | URL): string {
  return typeof input === 'string' ? input : input instanceof URL ? input.href : input.url;
}

/**
 * Replaces fetch for one test. Unknown routes answer 404 in the API's error shape, so a test
 * that forgets a route fails loudly instead of hanging.
 */
export function mockApi(handlers: ApiHandlers) {
  const calls: RecordedCall[] = [];
  const fetchMock = vi.fn((input: RequestInfo | URL, init?: RequestInit): Promise<Response> => {
    const url = requestUrl(input);
    const method = (init?.method ?? 'GET').toUpperCase();
    const address = new URL(url, 'http://crumbproof.test');
    const path = address.pathname;
    const body = typeof init?.body === 'string' ? (JSON.parse(init.body) as unknown) : undefined;
    const kitchen = new Headers(init?.headers).get(KITCHEN_HEADER);
    calls.push({ method, path, body, credentials: init?.credentials, kitchen, kitchenParam: address.searchParams.get('kitchen') });

    const handler = handlers[`${method} ${path}`];
    const answer: MockResponse | Promise<MockResponse> =
      handler === undefined
        ? { status: 404, body: { statusCode: 404, code: 'not-found', message: `No mock for ${method} ${path}.` } }
        : typeof handler === 'function'
          ? handler({ body, url, kitchen })
          : handler;
    return Promise.resolve(answer).then(({ status = 200, body: answered }) => {
      return new Response(answered === undefined || status === 204 ? null : JSON.stringify(answered), {
        status,
        headers: { 'Content-Type': 'application/json' },
      });
    });
  });
  vi.stubGlobal('fetch', fetchMock);
  return { calls, fetchMock };
}

/** The one kitchen of the people below, with their role there. */
function atLarchStreet(role: Role): Pick<Me, 'role' | 'kitchen' | 'kitchens'> {
  return { role, kitchen: 1, kitchens: [{ id: 1, code: null, name: 'Larch Street Bakehouse', role }] };
}

export const PEOPLE: Record<Role, Me> = {
  manager: { id: 1, email: 'maren@crumbproof.test', name: 'Maren Okafor', ...atLarchStreet('manager') },
  'pastry-chef': { id: 2, email: 'teodor@crumbproof.test', name: 'Teodor Lind', ...atLarchStreet('pastry-chef') },
  'front-of-house': { id: 3, email: 'priya@crumbproof.test', name: 'Priya Sandhu', ...atLarchStreet('front-of-house') },
};

/** Two kitchens of one recipe book, and someone who is manager of one and front of house in the other. */
export const TWO_KITCHENS: KitchenRole[] = [
  { id: 1, code: 'larch', name: 'Larch Street Bakehouse', role: 'manager' },
  { id: 2, code: 'saltmarsh', name: 'Saltmarsh Yard Café', role: 'front-of-house' },
];

/** Ines as /me answers her: for the kitchen the request named, or for none when it named none. */
export function inesAt(kitchen: string | null): Me {
  const at = TWO_KITCHENS.find((k) => String(k.id) === kitchen);
  return {
    id: 4,
    email: 'ines@crumbproof.test',
    name: 'Ines Duarte',
    role: at?.role ?? 'manager',
    kitchen: at?.id ?? null,
    kitchens: TWO_KITCHENS,
  };
}

/** The second kitchen's settings: its own name and regime. */
export const SALTMARSH: KitchenView = {
  id: 2,
  name: 'Saltmarsh Yard Café',
  regime: 'EU',
  address: '3 Saltmarsh Yard',
  measures: null,
  handles: [],
};

export const KITCHEN: KitchenView = {
  id: 1,
  name: 'Larch Street Bakehouse',
  regime: 'UK',
  address: '14 Larch Street',
  measures: null,
  handles: [{ allergen: 'sesame', controls: 'shared-equipment' }],
};

/** The kitchen's label settings as a new kitchen has them. */
export const LABEL_SETTINGS: LabelSettings = {
  batchPattern: '{YY}{MM}{DD}-{P}-{N}',
  gs1CompanyPrefix: null,
  ssccExtension: 0,
  caseIndicator: 1,
};

/** A person as the users list shows them at Larch Street: their role there. */
function listed({ id, email, name, role }: Me, active: boolean, createdAt: string): User {
  return { id, email, name, role, active, invitationPending: false, createdAt };
}

export const USERS: User[] = [
  listed(PEOPLE.manager, true, '2026-03-02T09:00:00.000Z'),
  listed(PEOPLE['pastry-chef'], true, '2026-03-04T09:00:00.000Z'),
  listed(PEOPLE['front-of-house'], false, '2026-05-20T09:00:00.000Z'),
];

/** The API as seen by a signed-in person of the given role. */
export function signedInAs(role: Role, extra: ApiHandlers = {}): ApiHandlers {
  return {
    'GET /api/me': { body: PEOPLE[role] },
    'GET /api/kitchen': { body: KITCHEN },
    'GET /api/book/kitchen': { body: { code: null, name: KITCHEN.name, substitutions: [], sells: null, notSold: [] } },
    'GET /api/labels/settings': { body: LABEL_SETTINGS },
    'GET /api/public-page/settings': { body: { enabled: false, baseUrl: null, updatedAt: null, kitchen: null } },
    'POST /api/auth/sign-out': { status: 204 },
    ...extra,
  };
}

export const signedOut: ApiHandlers = {
  'GET /api/me': { status: 401, body: { statusCode: 401, code: 'unauthenticated', message: 'Sign in first.' } },
};

/** The API's refusal of a body whose fields need attention (400 validation), each message for its field. */
export function fieldsRefused(fields: Record<string, string>): MockResponse {
  return {
    status: 400,
    body: {
      statusCode: 400,
      code: 'validation',
      message: 'Some fields need attention.',
      fields: Object.entries(fields).map(([path, message]) => ({ path, message })),
    },
  };
}

/** The API's message for a password on the common-passwords list (`passwordSchema` plus zxcvbn-ts in the API). */
export const COMMON_PASSWORD = 'This password is on a list of common passwords that are guessed first: choose another.';
