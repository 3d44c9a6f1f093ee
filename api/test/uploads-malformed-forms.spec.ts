import { fixture, multipart } from './fixtures/forms';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * A multipart body that cannot be read (RFC 7578 form data, framed by the boundary that the
 * Content-Type names, RFC 2046 section 5.1.1) is the sender's mistake: every upload route answers
 * 400 naming what is wrong with the form, and nothing is saved.
 */
describe('upload forms that cannot be read (real MariaDB)', () => {
  let t: TestApp;
  let chef: string;
  const reviewBy = (() => {
    const d = new Date();
    d.setDate(d.getDate() + 30);
    return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
  })();

  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    chef = await t.signIn('chef@example.com');
  });
  afterAll(() => t.close());

  const count = async (table: string) =>
    Number(((await t.sequelize.query(`SELECT COUNT(*) AS n FROM ${table}`, { plain: true })) as { n: number | bigint }).n);
  const saved = async () => ({
    specifications: await count('specifications'),
    ingredients: await count('ingredients'),
    revisions: await count('ingredient_revisions'),
  });

  const routes = [
    {
      route: 'the specification upload',
      url: '/api/ingredients/butter/specifications',
      form: () => multipart({ reviewBy }, { name: 'butter.pdf', bytes: fixture('almond-paste-spec.pdf') }),
    },
    {
      route: 'the spreadsheet import preview',
      url: '/api/ingredients/import/preview',
      form: () => multipart({}, { name: 'new.csv', bytes: fixture('new-ingredients.csv') }),
    },
    {
      route: 'the spreadsheet import',
      url: '/api/ingredients/import',
      // With the basis of a preview made just before, as the import page sends it.
      form: async () => {
        const file = { name: 'new.csv', bytes: fixture('new-ingredients.csv') };
        const shown = await multipart({}, file);
        const seen = await t.app.inject({
          method: 'POST',
          url: '/api/ingredients/import/preview',
          payload: shown.payload,
          headers: { ...shown.headers, cookie: chef },
        });
        return multipart({ basis: seen.json<{ basis: string }>().basis }, file);
      },
    },
  ];

  /** Each way of breaking a well-formed form: the Content-Type to send and the body. */
  const breakages = [
    {
      problem: 'a Content-Type without a boundary',
      message: /names no boundary/,
      broken: (payload: Buffer, _boundary: string) => ({ contentType: 'multipart/form-data', payload }),
    },
    {
      problem: 'a boundary the body does not use',
      message: /does not start with the boundary/,
      broken: (payload: Buffer, _boundary: string) => ({
        contentType: 'multipart/form-data; boundary=----not-the-boundary-of-this-body',
        payload,
      }),
    },
    {
      problem: 'a boundary longer than the 70 characters RFC 2046 allows',
      message: /its boundary is 300 characters long; RFC 2046 allows at most 70/,
      broken: (payload: Buffer, boundary: string) => {
        const long = 'b'.repeat(300);
        return {
          contentType: `multipart/form-data; boundary=${long}`,
          payload: Buffer.from(payload.toString('latin1').split(boundary).join(long), 'latin1'),
        };
      },
    },
    {
      problem: 'a body cut off in the middle of the file',
      message: /ends in the middle of a part/,
      broken: (payload: Buffer, boundary: string) => ({
        contentType: `multipart/form-data; boundary=${boundary}`,
        payload: payload.subarray(0, payload.lastIndexOf(`--${boundary}`) - 20),
      }),
    },
    {
      problem: 'a body whose closing boundary is missing',
      message: /ends in the middle of a part/,
      broken: (payload: Buffer, boundary: string) => ({
        contentType: `multipart/form-data; boundary=${boundary}`,
        payload: payload.subarray(0, payload.lastIndexOf(`--${boundary}`)),
      }),
    },
  ];

  const cases = routes.flatMap((r) => breakages.map((b) => ({ ...r, ...b })));

  it.each(cases)('$route: $problem is refused with 400 naming it, and nothing is saved', async ({ url, form, broken, message }) => {
    const before = await saved();
    const good = await form();
    const boundary = /boundary=(.+)$/.exec(good.headers['content-type'])![1];
    const { contentType, payload } = broken(good.payload, boundary);
    const res = await t.app.inject({ method: 'POST', url, payload, headers: { 'content-type': contentType, cookie: chef } });
    expect(res.statusCode).toBe(400);
    expect(res.json()).toMatchObject({ statusCode: 400, code: 'validation', message: expect.stringMatching(message) });
    expect(res.json().message).toMatch(/^The form could not be read: /);
    expect(await saved()).toEqual(before);
  });

  it.each(routes)('$route still takes the same form when it is whole', async ({ url, form }) => {
    const good = await form();
    const res = await t.app.inject({ method: 'POST', url, payload: good.payload, headers: { ...good.headers, cookie: chef } });
    expect(res.statusCode).toBeLessThan(300);
  });
});
