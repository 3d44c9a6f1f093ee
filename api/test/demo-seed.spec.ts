import { KITCHEN_HEADER, type Me } from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { tableChecksums } from './fixtures/table-checksums';
import { startAppWith } from './support/app-with-settings';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * The app's demo (`npm start` on an empty database, `db setup`): the chain of two kitchens over one
 * recipe book, its people with a role at each of their kitchens, and every product approved at each
 * kitchen by that kitchen's manager. Seeded into an empty database only.
 */
describe('the demo seed: two kitchens into an empty database, and nowhere else (real MariaDB)', () => {
  let t: TestApp;
  let seeded: 'seeded' | 'kept';
  beforeAll(async () => {
    t = await startTestApp();
    const { SeedService } = await import('../src/database/seed.service');
    seeded = await t.app.get(SeedService).seedDemo();
  });
  afterAll(() => t.close());

  const rows = <T extends object>(sql: string) => t.sequelize.query<T>(sql, { type: QueryTypes.SELECT });
  const at = (kitchen: number, url: string, cookie: string) =>
    t.app.inject({ method: 'GET', url, headers: { cookie, [KITCHEN_HEADER]: String(kitchen) } });
  const kitchens = async () =>
    rows<{ id: number; code: string; name: string; regime: string }>('SELECT id, code, name, regime FROM sites ORDER BY id');
  const byCode = async () => Object.fromEntries((await kitchens()).map((k) => [k.code, k.id]));

  it('seeds both kitchens of the demo chain, the bakehouse first (it owns the book)', async () => {
    expect(seeded).toBe('seeded');
    expect(await kitchens()).toEqual([
      expect.objectContaining({ code: 'wrenfield-lane', name: 'Wrenfield Lane Bakehouse', regime: 'UK' }),
      expect.objectContaining({ code: 'saltmarsh-cafe', name: 'Saltmarsh Yard Café', regime: 'EU' }),
    ]);
  });

  it('gives each demo person their role at each of their kitchens, and none elsewhere', async () => {
    const roles = await rows<{ email: string; code: string; role: string }>(
      'SELECT u.email, s.code, r.role FROM kitchen_roles r JOIN users u ON u.id = r.user_id JOIN sites s ON s.id = r.site_id ORDER BY u.id, s.id',
    );
    expect(roles.map((r) => `${r.email} ${r.code} ${r.role}`)).toEqual([
      'manager@example.com wrenfield-lane manager',
      'manager@example.com saltmarsh-cafe manager',
      'chef@example.com wrenfield-lane pastry-chef',
      'chef@example.com saltmarsh-cafe pastry-chef',
      'counter@example.com wrenfield-lane front-of-house',
      'cafe@example.com saltmarsh-cafe front-of-house',
      'quay@example.com wrenfield-lane front-of-house',
      'quay@example.com saltmarsh-cafe manager',
    ]);
    // Signed in, the person of two roles is told their role at each kitchen.
    const quay = await t.signIn('quay@example.com');
    const me = (await t.req('GET', '/api/me', quay)).json<Me>();
    expect(me.kitchens.map((k) => [k.code, k.role])).toEqual([
      ['wrenfield-lane', 'front-of-house'],
      ['saltmarsh-cafe', 'manager'],
    ]);
  });

  it('approves every product at each kitchen, by that kitchen’s manager, so nothing waits at either', async () => {
    const ids = await byCode();
    const approvals = await rows<{ siteId: number; regime: string; n: number | bigint; by: string }>(
      `SELECT a.site_id AS siteId, a.regime, COUNT(*) AS n, GROUP_CONCAT(DISTINCT u.email) AS \`by\`
         FROM product_approvals a JOIN users u ON u.id = a.approved_by GROUP BY a.site_id, a.regime ORDER BY a.site_id`,
    );
    expect(approvals.map((a) => [a.siteId, a.regime, Number(a.n), a.by])).toEqual([
      [ids['wrenfield-lane'], 'UK', 20, 'manager@example.com'],
      [ids['saltmarsh-cafe'], 'EU', 18, 'manager@example.com'],
    ]);
    const quay = await t.signIn('quay@example.com');
    const manager = await t.signIn('manager@example.com');
    for (const [kitchen, cookie, approved] of [
      [ids['wrenfield-lane'], manager, 20],
      [ids['saltmarsh-cafe'], quay, 18],
    ] as const) {
      const list = await at(kitchen, '/api/approvals', cookie);
      expect(list.statusCode).toBe(200);
      expect(list.json()).toMatchObject({ pending: [], approvedCount: approved });
    }
  });

  it('keeps label settings for each kitchen, each with an SSCC extension of its own', async () => {
    const ids = await byCode();
    const manager = await t.signIn('manager@example.com');
    const bakehouse = (await at(ids['wrenfield-lane'], '/api/labels/settings', manager)).json();
    const cafe = (await at(ids['saltmarsh-cafe'], '/api/labels/settings', manager)).json();
    expect(bakehouse).toMatchObject({ gs1CompanyPrefix: '9521234', ssccExtension: 0, batchPattern: '{YY}{MM}{DD}-{P}-{N}' });
    expect(cafe).toMatchObject({ gs1CompanyPrefix: '9521234', ssccExtension: 1, batchPattern: 'SY{YY}{MM}{DD}-{P}-{N}' });
  });

  it('seeds nothing the second time: every table as it was', async () => {
    const { SeedService } = await import('../src/database/seed.service');
    const before = await tableChecksums(t.sequelize);
    expect(await t.app.get(SeedService).seedDemo()).toBe('kept');
    expect(await tableChecksums(t.sequelize)).toEqual(before);
  });

  it('seeds nothing into a database that already holds a kitchen', async () => {
    const other = await startAppWith({}, { database: `${process.env.DB_NAME}_kept`, seed: true });
    try {
      const before = await tableChecksums(other.sequelize);
      expect(await other.seedDemo()).toBe('kept');
      expect(await tableChecksums(other.sequelize)).toEqual(before);
      const [{ n }] = await other.sequelize.query<{ n: number | bigint }>('SELECT COUNT(*) AS n FROM sites', { type: QueryTypes.SELECT });
      expect(Number(n)).toBe(1);
    } finally {
      await other.close();
    }
  });
});
