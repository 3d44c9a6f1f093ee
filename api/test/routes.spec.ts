import { request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import { DiscoveryService, MetadataScanner, Reflector } from '@nestjs/core';
import { KITCHEN_HEADER, type Role } from '@crumbproof/shared';
import bcrypt from 'bcryptjs';
import { tableChecksums } from './fixtures/table-checksums';
import { registeredRoutes } from '../src/app.factory';
import { IS_PUBLIC, Roles } from '../src/common/roles.decorator';
import { startTestApp, type TestApp } from './support/test-app';
import { addPerson, setUpTwoKitchens } from './support/two-kitchens';

const CALLERS = ['anonymous', 'front-of-house', 'pastry-chef', 'manager'] as const;
type Caller = (typeof CALLERS)[number];

/**
 * Every route the app registers, and what each caller gets from it: anonymous, front of house,
 * pastry chef, manager. The kitchen is empty (no site, no items) and every body is {} or none,
 * so a caller who passes the role rule gets the route's own answer (400 for a bad body, 404 for
 * no kitchen or no such item) and nothing changes. A route missing here fails the test.
 */
const EXPECTED: Record<string, [anonymous: number, frontOfHouse: number, pastryChef: number, manager: number]> = {
  'GET /api/health': [200, 200, 200, 200],
  'POST /api/auth/sign-in': [400, 400, 400, 400],
  'POST /api/auth/sign-out': [204, 204, 204, 204],
  'POST /api/auth/first-manager': [400, 400, 400, 400],
  'GET /api/me': [401, 200, 200, 200],
  'GET /api/users': [401, 403, 403, 200],
  'POST /api/users': [401, 403, 403, 400],
  'PATCH /api/users/:id': [401, 403, 403, 400],
  'DELETE /api/users/:id/kitchen': [401, 403, 403, 404],
  'POST /api/users/invitations': [401, 403, 403, 400],
  'POST /api/users/:id/invitation': [401, 403, 403, 404],
  // Mailed links and "Forgot your password?" need no session: the body is checked first.
  'POST /api/auth/password-reset': [400, 400, 400, 400],
  'POST /api/auth/account-link': [400, 400, 400, 400],
  'POST /api/auth/set-password': [400, 400, 400, 400],
  'GET /api/mail/outbox': [401, 403, 403, 200],
  'POST /api/mail/outbox/:id/retry': [401, 403, 403, 404],
  'GET /api/kitchen': [401, 404, 404, 404],
  'PATCH /api/kitchen': [401, 403, 403, 400],
  'GET /api/book': [401, 403, 404, 404],
  'GET /api/book/kitchen': [401, 403, 404, 404],
  'POST /api/book/import': [401, 403, 403, 400],
  'GET /api/ingredients': [401, 403, 404, 404],
  'POST /api/ingredients': [401, 403, 400, 400],
  'GET /api/ingredients/:code': [401, 403, 404, 404],
  'PUT /api/ingredients/:code': [401, 403, 400, 400],
  'GET /api/ingredients/:code/revisions': [401, 403, 404, 404],
  'GET /api/ingredients/:code/used-in': [401, 403, 404, 404],
  'GET /api/ingredients/:code/specifications': [401, 403, 404, 404],
  'POST /api/ingredients/:code/specifications': [401, 403, 400, 400],
  'GET /api/specifications/status': [401, 403, 404, 404],
  'GET /api/specifications/reviews-due': [401, 403, 404, 404],
  'GET /api/specifications/:id/file': [401, 403, 404, 404],
  'GET /api/ingredients/import/template.csv': [401, 403, 200, 200],
  'GET /api/ingredients/import/template.xlsx': [401, 403, 200, 200],
  'POST /api/ingredients/import/preview': [401, 403, 400, 400],
  'POST /api/ingredients/import': [401, 403, 400, 400],
  'GET /api/recipes': [401, 404, 404, 404],
  'POST /api/recipes': [401, 403, 400, 400],
  'GET /api/recipes/:code': [401, 404, 404, 404],
  'PUT /api/recipes/:code': [401, 403, 400, 400],
  'GET /api/recipes/:code/revisions': [401, 403, 404, 404],
  'GET /api/recipes/:code/used-in': [401, 403, 404, 404],
  'GET /api/recipes/:code/declaration': [401, 404, 404, 404],
  'GET /api/declarations': [401, 404, 404, 404],
  'POST /api/declarations/preview': [401, 403, 400, 400],
  'POST /api/swaps/preview': [401, 403, 400, 400],
  'POST /api/swaps/apply': [401, 403, 400, 400],
  'GET /api/reference/nutrients': [401, 403, 200, 200],
  'GET /api/reference/allergen-sources': [401, 200, 200, 200],
  'POST /api/composition/scan': [401, 403, 400, 400],
  'GET /api/labels/templates': [401, 403, 200, 200],
  'GET /api/labels/settings': [401, 403, 404, 404],
  'PUT /api/labels/settings': [401, 403, 403, 400],
  'POST /api/labels/runs': [401, 403, 400, 400],
  'GET /api/labels/runs': [401, 403, 404, 404],
  'GET /api/labels/runs/:id/pdf': [401, 403, 404, 404],
  'GET /api/labels/stale': [401, 403, 404, 404],
  'POST /api/labels/stale/:id/handled': [401, 403, 403, 400],
  // Approvals: the pastry chef reads what waits, the manager approves.
  'GET /api/approvals': [401, 403, 404, 404],
  'POST /api/approvals': [401, 403, 403, 400],
  // The audit trail and the recall (manager): an empty trail is a page of none; a recall needs its batch.
  'GET /api/audit': [401, 403, 403, 200],
  'GET /api/audit/export.csv': [401, 403, 403, 200],
  'GET /api/audit/recall': [401, 403, 403, 400],
  'GET /api/audit/:id': [401, 403, 403, 404],
  'GET /api/counter/products': [401, 404, 404, 404],
  // No kitchen: refused before any stream opens.
  'GET /api/counter/events': [401, 404, 404, 404],
  'GET /api/counter/today': [401, 404, 404, 404],
  'PUT /api/counter/today': [401, 403, 400, 400],
  'POST /api/counter/questions': [401, 400, 400, 400],
  'GET /api/counter/questions': [401, 404, 404, 404],
  'POST /api/counter/questions/:id/answer': [401, 403, 400, 400],
  'GET /api/public-page/settings': [401, 403, 404, 404],
  'PUT /api/public-page/settings': [401, 403, 403, 400],
  // The public product page: no sign-in, and the same page in words for every address that is no published product.
  'GET /p/:code': [404, 404, 404, 404],
  'GET /p/:kitchen/:code': [404, 404, 404, 404],
  'GET /p/fonts/:file': [404, 404, 404, 404],
  // The OpenAPI document and its viewer are public: they describe the routes, not the kitchen.
  'GET /api/docs': [200, 200, 200, 200],
  'GET /api/docs/': [200, 200, 200, 200],
  'GET /api/docs/index.html': [200, 200, 200, 200],
  'GET /api/docs/swagger-ui-init.js': [200, 200, 200, 200],
  'GET /api/docs/docs/swagger-ui-init.js': [200, 200, 200, 200],
  'GET /api/docs/LICENSE': [404, 404, 404, 404],
  'GET /api/docs/*': [200, 200, 200, 200],
  'GET /api/docs/docs/*': [200, 200, 200, 200],
  'GET /api/docs-json': [200, 200, 200, 200],
  'GET /api/docs-yaml': [200, 200, 200, 200],
};

const EMAILS: Record<Exclude<Caller, 'anonymous'>, string> = {
  'front-of-house': 'counter@example.com',
  'pastry-chef': 'chef@example.com',
  manager: 'manager@example.com',
};
const PASSWORD = 'route-matrix-pass-41';

describe('every route answers each caller as the table says', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
    const hash = bcrypt.hashSync(PASSWORD, 4);
    for (const [role, email] of Object.entries(EMAILS)) {
      await t.sequelize.query(
        "INSERT INTO users (email, name, role, password_hash, active, created_at, updated_at) VALUES (?, 'Matrix', ?, ?, TRUE, NOW(), NOW())",
        { replacements: [email, role, hash] },
      );
    }
  });
  afterAll(() => t.close());

  it('has a row for every registered route and no row for a route that is gone', () => {
    const registered = registeredRoutes(t.app).map((r) => `${r.method} ${r.url}`);
    expect(new Set(registered).size).toBe(registered.length);
    expect([...registered].sort()).toEqual(Object.keys(EXPECTED).sort());
  });

  it.each(Object.entries(EXPECTED))('%s → %j', async (route, statuses) => {
    const [method, path] = route.split(' ') as [string, string];
    const url = path.replace(':code', 'no-such-code').replace(':id', '999999').replace('*', 'swagger-ui.css');
    // Upload routes get no body (a JSON one is refused before the role rule); the others get {}.
    const isUpload = method === 'POST' && /\/specifications$|\/ingredients\/import/.test(path);
    const payload = ['POST', 'PUT', 'PATCH'].includes(method) && !isUpload ? {} : undefined;
    const got: number[] = [];
    for (const caller of CALLERS) {
      // A fresh session for every call: signing out, or anything else a route does, leaves the others alone.
      const cookie = caller === 'anonymous' ? undefined : await t.signIn(EMAILS[caller], PASSWORD);
      const res = await t.app.inject({ method: method as 'GET', url, headers: cookie ? { cookie } : {}, ...(payload ? { payload } : {}) });
      got.push(res.statusCode);
      if (res.statusCode === 401) expect(res.json()).toMatchObject({ code: 'unauthenticated' });
      if (res.statusCode === 403) expect(res.json()).toMatchObject({ code: 'forbidden' });
    }
    expect(got).toEqual(statuses);
  });
});

/**
 * The same routes on an installation of two kitchens over one recipe book (the two-site book
 * imported by a manager): kitchen A, the book's owner ("Test bench"), and kitchen B ("Corner
 * Shop"). What a person with a role at kitchen B only gets from each route at B, as front of
 * house, pastry chef and manager, with the same addresses and bodies as above: the kitchen now
 * has its items, so lists answer and addresses of no item are not found.
 */
const AT_B: Record<string, [frontOfHouse: number, pastryChef: number, manager: number]> = {
  'GET /api/health': [200, 200, 200],
  'POST /api/auth/sign-in': [400, 400, 400],
  'POST /api/auth/sign-out': [204, 204, 204],
  'POST /api/auth/first-manager': [400, 400, 400],
  'GET /api/me': [200, 200, 200],
  'GET /api/users': [403, 403, 200],
  'POST /api/users': [403, 403, 400],
  'PATCH /api/users/:id': [403, 403, 400],
  'DELETE /api/users/:id/kitchen': [403, 403, 404],
  'POST /api/users/invitations': [403, 403, 400],
  'POST /api/users/:id/invitation': [403, 403, 404],
  'POST /api/auth/password-reset': [400, 400, 400],
  'POST /api/auth/account-link': [400, 400, 400],
  'POST /api/auth/set-password': [400, 400, 400],
  'GET /api/mail/outbox': [403, 403, 200],
  'POST /api/mail/outbox/:id/retry': [403, 403, 404],
  'GET /api/kitchen': [200, 200, 200],
  'PATCH /api/kitchen': [403, 403, 400],
  'GET /api/book': [403, 200, 200],
  'GET /api/book/kitchen': [403, 200, 200],
  'POST /api/book/import': [403, 403, 400],
  'GET /api/ingredients': [403, 200, 200],
  'POST /api/ingredients': [403, 400, 400],
  'GET /api/ingredients/:code': [403, 404, 404],
  'PUT /api/ingredients/:code': [403, 400, 400],
  'GET /api/ingredients/:code/revisions': [403, 404, 404],
  'GET /api/ingredients/:code/used-in': [403, 404, 404],
  'GET /api/ingredients/:code/specifications': [403, 404, 404],
  'POST /api/ingredients/:code/specifications': [403, 400, 400],
  'GET /api/specifications/status': [403, 200, 200],
  'GET /api/specifications/reviews-due': [403, 200, 200],
  'GET /api/specifications/:id/file': [403, 404, 404],
  'GET /api/ingredients/import/template.csv': [403, 200, 200],
  'GET /api/ingredients/import/template.xlsx': [403, 200, 200],
  'POST /api/ingredients/import/preview': [403, 400, 400],
  'POST /api/ingredients/import': [403, 400, 400],
  'GET /api/recipes': [200, 200, 200],
  'POST /api/recipes': [403, 400, 400],
  'GET /api/recipes/:code': [404, 404, 404],
  'PUT /api/recipes/:code': [403, 400, 400],
  'GET /api/recipes/:code/revisions': [403, 404, 404],
  'GET /api/recipes/:code/used-in': [403, 404, 404],
  'GET /api/recipes/:code/declaration': [404, 404, 404],
  'GET /api/declarations': [200, 200, 200],
  'POST /api/declarations/preview': [403, 400, 400],
  'POST /api/swaps/preview': [403, 400, 400],
  'POST /api/swaps/apply': [403, 400, 400],
  'GET /api/reference/nutrients': [403, 200, 200],
  'GET /api/reference/allergen-sources': [200, 200, 200],
  'POST /api/composition/scan': [403, 400, 400],
  'GET /api/labels/templates': [403, 200, 200],
  'GET /api/labels/settings': [403, 200, 200],
  'PUT /api/labels/settings': [403, 403, 400],
  'POST /api/labels/runs': [403, 400, 400],
  'GET /api/labels/runs': [403, 200, 200],
  'GET /api/labels/runs/:id/pdf': [403, 404, 404],
  'GET /api/labels/stale': [403, 200, 200],
  'POST /api/labels/stale/:id/handled': [403, 403, 400],
  'GET /api/approvals': [403, 200, 200],
  'POST /api/approvals': [403, 403, 400],
  'GET /api/audit': [403, 403, 200],
  'GET /api/audit/export.csv': [403, 403, 200],
  'GET /api/audit/recall': [403, 403, 400],
  'GET /api/audit/:id': [403, 403, 404],
  'GET /api/counter/products': [200, 200, 200],
  // The stream opens (read by a real HTTP client, and closed at its first answer).
  'GET /api/counter/events': [200, 200, 200],
  'GET /api/counter/today': [200, 200, 200],
  'PUT /api/counter/today': [403, 400, 400],
  'POST /api/counter/questions': [400, 400, 400],
  'GET /api/counter/questions': [200, 200, 200],
  'POST /api/counter/questions/:id/answer': [403, 400, 400],
  'GET /api/public-page/settings': [403, 200, 200],
  'PUT /api/public-page/settings': [403, 403, 400],
  'GET /p/:code': [404, 404, 404],
  'GET /p/:kitchen/:code': [404, 404, 404],
  'GET /p/fonts/:file': [404, 404, 404],
  'GET /api/docs': [200, 200, 200],
  'GET /api/docs/': [200, 200, 200],
  'GET /api/docs/index.html': [200, 200, 200],
  'GET /api/docs/swagger-ui-init.js': [200, 200, 200],
  'GET /api/docs/docs/swagger-ui-init.js': [200, 200, 200],
  'GET /api/docs/LICENSE': [404, 404, 404],
  'GET /api/docs/*': [200, 200, 200],
  'GET /api/docs/docs/*': [200, 200, 200],
  'GET /api/docs-json': [200, 200, 200],
  'GET /api/docs-yaml': [200, 200, 200],
};

const AT_B_ONLY = {
  'front-of-house': 'b-counter@example.com',
  'pastry-chef': 'b-chef@example.com',
  manager: 'b-manager@example.com',
} as const;

/** A route is public when it answers anonymous callers without asking them to sign in. */
const isPublic = (route: string) => EXPECTED[route][0] !== 401;

describe('with two kitchens, a person of kitchen B only is refused at kitchen A and answered at B', () => {
  let t: TestApp;
  let port: number;
  const kitchen = { A: '', B: '' };
  beforeAll(async () => {
    t = await startTestApp();
    ({ A: kitchen.A, B: kitchen.B } = await setUpTwoKitchens(t, PASSWORD));
    for (const [role, email] of Object.entries(AT_B_ONLY)) await addPerson(t, email, role as Role, PASSWORD, 'corner');
    await t.app.listen(0, '127.0.0.1');
    port = (t.app.getHttpServer().address() as AddressInfo).port;
  });
  afterAll(() => t.close());

  /** One call as the matrix makes it, naming a kitchen; the events stream through a real HTTP client, closed at its first answer. */
  const call = async (route: string, cookie: string, named: string) => {
    const [method, path] = route.split(' ') as [string, string];
    const url = path.replace(':code', 'no-such-code').replace(':id', '999999').replace('*', 'swagger-ui.css');
    const headers = { cookie, [KITCHEN_HEADER]: named };
    if (route === 'GET /api/counter/events')
      return new Promise<{ statusCode: number; code?: string }>((resolve, reject) => {
        const req = httpRequest({ host: '127.0.0.1', port, path: url, headers }, (res) => {
          let body = '';
          res.setEncoding('utf8');
          if (res.statusCode === 200) {
            req.destroy();
            resolve({ statusCode: 200 });
          }
          res.on('data', (chunk: string) => (body += chunk));
          res.on('end', () =>
            resolve({
              statusCode: res.statusCode!,
              code: res.statusCode === 403 ? (JSON.parse(body) as { code?: string }).code : undefined,
            }),
          );
        });
        req.on('error', reject);
        req.end();
      });
    const isUpload = method === 'POST' && /\/specifications$|\/ingredients\/import/.test(path);
    const payload = ['POST', 'PUT', 'PATCH'].includes(method) && !isUpload ? {} : undefined;
    const res = await t.app.inject({ method: method as 'GET', url, headers, ...(payload ? { payload } : {}) });
    return { statusCode: res.statusCode, code: res.statusCode === 403 ? res.json<{ code?: string }>().code : undefined };
  };

  const signInAll = async () => {
    const cookies: string[] = [];
    for (const email of Object.values(AT_B_ONLY)) cookies.push(await t.signIn(email, PASSWORD));
    return cookies;
  };

  it('has a row for every registered route', () => {
    expect(Object.keys(AT_B).sort()).toEqual(
      registeredRoutes(t.app)
        .map((r) => `${r.method} ${r.url}`)
        .sort(),
    );
  });

  it('refuses kitchen A named by the query parameter too, where a header cannot be sent', async () => {
    const [, chef] = await signInAll();
    for (const url of [`/api/ingredients?kitchen=${kitchen.A}`, `/api/counter/products?kitchen=${kitchen.A}`]) {
      const res = await t.app.inject({ method: 'GET', url, headers: { cookie: chef } });
      expect(res.statusCode).toBe(403);
      expect(res.json().message).toMatch(/You have no role at that kitchen/);
    }
    const atB = await t.app.inject({ method: 'GET', url: `/api/counter/products?kitchen=${kitchen.B}`, headers: { cookie: chef } });
    expect(atB.statusCode).toBe(200);
  });

  it.each(Object.entries(AT_B))('%s at B → %j, and refused at A changing nothing', async (route, statuses) => {
    // A fresh session for each caller: a route that signs out leaves the others alone.
    const cookies = await signInAll();
    const before = await tableChecksums(t.sequelize);
    const atA = [];
    for (const cookie of cookies) atA.push(await call(route, cookie, kitchen.A));
    if (isPublic(route)) {
      // A public route is for no kitchen: naming one changes nothing of its answer.
      expect(atA.map((r) => r.statusCode)).toEqual(statuses);
    } else {
      expect(atA).toEqual(cookies.map(() => ({ statusCode: 403, code: 'forbidden' })));
      expect(await tableChecksums(t.sequelize)).toEqual(before);
    }
    const atB = [];
    for (const cookie of await signInAll()) atB.push((await call(route, cookie, kitchen.B)).statusCode);
    expect(atB).toEqual(statuses);
  });
});

describe('every route states who may call it', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('has @Roles or @Public on each handler (default deny otherwise)', () => {
    const discovery = t.app.get(DiscoveryService);
    const scanner = t.app.get(MetadataScanner);
    const reflector = t.app.get(Reflector);
    const missing: string[] = [];
    let handlers = 0;
    for (const wrapper of discovery.getControllers()) {
      const instance = wrapper.instance as object;
      const proto = Object.getPrototypeOf(instance);
      for (const name of scanner.getAllMethodNames(proto)) {
        const handler = proto[name];
        if (!Reflect.getMetadata('path', handler) && Reflect.getMetadata('path', handler) !== '') continue;
        handlers++;
        const roles = reflector.getAllAndOverride(Roles, [handler, wrapper.metatype as never]);
        const isPublic = reflector.getAllAndOverride(IS_PUBLIC, [handler, wrapper.metatype as never]);
        if (!roles && !isPublic) missing.push(`${wrapper.name}.${name}`);
      }
    }
    expect(handlers).toBeGreaterThan(10);
    expect(missing).toEqual([]);
  });

  it('publishes an OpenAPI document listing the routes', async () => {
    const res = await t.app.inject({ method: 'GET', url: '/api/docs-json' });
    expect(res.statusCode).toBe(200);
    const doc = res.json();
    expect(Object.keys(doc.paths)).toEqual(expect.arrayContaining(['/api/auth/sign-in', '/api/auth/sign-out', '/api/me', '/api/users']));
    expect(doc.paths['/api/auth/sign-in'].post.requestBody.content['application/json'].schema.properties).toHaveProperty('email');
    const ui = await t.app.inject({ method: 'GET', url: '/api/docs' });
    expect(ui.statusCode).toBe(200);
  });
});
