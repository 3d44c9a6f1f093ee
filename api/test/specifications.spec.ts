import { createHash } from 'node:crypto';
import { fixture, multipart, type FormFile } from './fixtures/forms';
import { startTestApp, type TestApp } from './support/test-app';

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');
const isoDay = (offsetDays: number) => {
  const d = new Date();
  d.setDate(d.getDate() + offsetDays);
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
};

describe('supplier specifications (real MariaDB)', () => {
  let t: TestApp;
  let chef: string;
  let manager: string;
  let counter: string;
  const pdf = fixture('almond-paste-spec.pdf');
  const png = fixture('label-photo.png');

  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    [chef, manager, counter] = await Promise.all(
      ['chef@example.com', 'manager@example.com', 'counter@example.com'].map((e) => t.signIn(e)),
    );
  });
  afterAll(() => t.close());

  const upload = async (code: string, fields: Record<string, string>, file?: FormFile, cookie = chef) => {
    const form = await multipart(fields, ...(file ? [file] : []));
    return t.app.inject({
      method: 'POST',
      url: `/api/ingredients/${code}/specifications`,
      payload: form.payload,
      headers: { ...form.headers, cookie },
    });
  };
  const get = (url: string, cookie = chef) => t.app.inject({ method: 'GET', url, headers: { cookie } });
  const storedRows = async () =>
    ((await t.sequelize.query('SELECT COUNT(*) AS n FROM specifications', { plain: true })) as { n: number | bigint }).n;

  it('accepts a PDF and versions each upload, newest first', async () => {
    const first = await upload(
      'ground-almonds',
      { reviewBy: isoDay(180), note: 'From the 2026 price list' },
      { name: 'almond-spec.pdf', bytes: pdf, type: 'application/pdf' },
    );
    expect(first.statusCode).toBe(201);
    expect(first.json()).toEqual({
      id: expect.any(Number),
      ingredient: 'ground-almonds',
      version: 1,
      filename: 'almond-spec.pdf',
      mediaType: 'application/pdf',
      sizeBytes: pdf.length,
      sha256: sha256(pdf),
      reviewBy: isoDay(180),
      note: 'From the 2026 price list',
      uploadedBy: { id: expect.any(Number), name: expect.any(String) },
      uploadedAt: expect.any(String),
      current: true,
      reviewOverdue: false,
      fileUrl: `/api/specifications/${first.json().id}/file`,
    });
    expect(first.body).not.toMatch(/content/);

    const second = await upload('ground-almonds', { reviewBy: isoDay(365) }, { name: 'almond-spec-v2.pdf', bytes: pdf }, manager);
    expect(second.statusCode).toBe(201);
    expect(second.json()).toMatchObject({ version: 2, note: '', current: true });

    const list = await get('/api/ingredients/ground-almonds/specifications');
    expect(list.statusCode).toBe(200);
    expect(list.json().map((s: { version: number; current: boolean; filename: string }) => [s.version, s.current, s.filename])).toEqual([
      [2, true, 'almond-spec-v2.pdf'],
      [1, false, 'almond-spec.pdf'],
    ]);
  });

  it('accepts a PNG, whatever type the browser claims, and stores the type found in the bytes', async () => {
    const res = await upload('walnuts', { reviewBy: isoDay(0) }, { name: 'walnut label.png', bytes: png, type: 'application/pdf' });
    expect(res.statusCode).toBe(201);
    expect(res.json()).toMatchObject({
      version: 1,
      mediaType: 'image/png',
      filename: 'walnut label.png',
      reviewBy: isoDay(0),
      reviewOverdue: false,
    });
  });

  it('sanitises the file name: no folders, no control or reserved characters', async () => {
    const res = await upload('walnuts', { reviewBy: isoDay(30) }, { name: '..\\..\\kitchen/walnut<v1>|final?.png', bytes: png });
    expect(res.statusCode).toBe(201);
    expect(res.json().filename).toBe('walnutv1final.png');
  });

  it('refuses a text file named spec.pdf with 400 and stores nothing', async () => {
    const before = await storedRows();
    const res = await upload(
      'butter',
      { reviewBy: isoDay(30) },
      { name: 'spec.pdf', bytes: fixture('not-really-a.pdf'), type: 'application/pdf' },
    );
    expect(res.statusCode).toBe(400);
    expect(res.json()).toMatchObject({
      code: 'validation',
      message: 'Only PDF files and images (PNG, JPEG, WebP) can be attached; this file is not a recognised type.',
      fields: [{ path: 'file' }],
    });
    expect(await storedRows()).toBe(before);
    expect((await get('/api/ingredients/butter/specifications')).json()).toEqual([]);
  });

  it('names what a refused picture is', async () => {
    const res = await upload('butter', { reviewBy: isoDay(30) }, { name: 'swatch.png', bytes: fixture('swatch.gif'), type: 'image/png' });
    expect(res.statusCode).toBe(400);
    expect(res.json().message).toBe('Only PDF files and images (PNG, JPEG, WebP) can be attached; this file is a GIF file (image/gif).');
  });

  it('refuses a file over 10 MB with 413 and a plain message, storing nothing', async () => {
    const before = await storedRows();
    const big = Buffer.concat([pdf, Buffer.alloc(10 * 1024 * 1024 + 1 - pdf.length, 0x20)]);
    const res = await upload('butter', { reviewBy: isoDay(30) }, { name: 'huge.pdf', bytes: big });
    expect(res.statusCode).toBe(413);
    expect(res.json()).toMatchObject({
      code: 'too-large',
      message: 'The file is larger than 10 MB, the most an upload may be. Attach a smaller file.',
    });
    expect(await storedRows()).toBe(before);

    const atTheLimit = Buffer.concat([pdf, Buffer.alloc(10 * 1024 * 1024 - pdf.length, 0x20)]);
    const accepted = await upload('yeast', { reviewBy: isoDay(30) }, { name: 'scan.pdf', bytes: atTheLimit });
    expect(accepted.statusCode).toBe(201);
    expect(accepted.json().sizeBytes).toBe(10 * 1024 * 1024);
    expect(sha256((await get(accepted.json().fileUrl)).rawPayload)).toBe(sha256(atTheLimit));
  });

  it('refuses a second file in the form', async () => {
    const before = await storedRows();
    const form = await multipart({ reviewBy: isoDay(30) }, { name: 'a.pdf', bytes: pdf }, { name: 'b.pdf', bytes: pdf });
    const res = await t.app.inject({
      method: 'POST',
      url: '/api/ingredients/butter/specifications',
      payload: form.payload,
      headers: { ...form.headers, cookie: chef },
    });
    expect(res.statusCode).toBe(400);
    expect(res.json().message).toBe('Attach one file only.');
    expect(await storedRows()).toBe(before);
  });

  it.each<{ case: string; fields: Record<string, string>; message: RegExp }>([
    {
      case: 'written another way',
      fields: { reviewBy: '1 March 2031' },
      message: /reviewBy: '1 March 2031' is not a date written as YYYY-MM-DD/,
    },
    { case: 'in the past', fields: { reviewBy: isoDay(-1) }, message: new RegExp(`reviewBy: ${isoDay(-1)} has already passed`) },
    { case: 'not a real date', fields: { reviewBy: '2031-02-30' }, message: /reviewBy: 2031-02-30 is not a real date/ },
    { case: 'not a date', fields: { reviewBy: 'next spring' }, message: /reviewBy: 'next spring' is not a date written as YYYY-MM-DD/ },
  ])('refuses a reviewBy that is $case, naming the field, and stores nothing', async ({ fields, message }) => {
    const before = await storedRows();
    const res = await upload('butter', fields, { name: 'butter.pdf', bytes: pdf });
    expect(res.statusCode).toBe(400);
    expect(res.json().fields).toEqual([{ path: 'reviewBy', message: expect.any(String) }]);
    expect(res.json().message).toMatch(message);
    expect(await storedRows()).toBe(before);
  });

  it('refuses a form without a file, or with an unknown field', async () => {
    const none = await upload('butter', { reviewBy: isoDay(30) });
    expect(none.statusCode).toBe(400);
    expect(none.json().fields).toEqual([{ path: 'file', message: expect.stringMatching(/Attach the specification/) }]);
    const extra = await upload('butter', { reviewBy: isoDay(30), reviewby: isoDay(30) }, { name: 'butter.pdf', bytes: pdf });
    expect(extra.statusCode).toBe(400);
    expect(extra.json().fields).toEqual([{ path: 'reviewby', message: expect.stringMatching(/no field 'reviewby'/) }]);
    const json = await t.app.inject({
      method: 'POST',
      url: '/api/ingredients/butter/specifications',
      payload: { reviewBy: isoDay(30) },
      headers: { cookie: chef },
    });
    // A JSON body on an upload route is refused before it is read: 415 Unsupported Media Type.
    expect(json.statusCode).toBe(415);
    expect(json.json().message).toMatch(/multipart\/form-data/);
  });

  it('answers 404 for an unknown ingredient and stores nothing', async () => {
    const before = await storedRows();
    const res = await upload('unicorn-dust', { reviewBy: isoDay(30) }, { name: 'spec.pdf', bytes: pdf });
    expect(res.statusCode).toBe(404);
    expect(res.json()).toMatchObject({ code: 'not-found', message: "There is no ingredient 'unicorn-dust'." });
    expect(await storedRows()).toBe(before);
    expect((await get('/api/ingredients/unicorn-dust/specifications')).statusCode).toBe(404);
  });

  it('refuses front of house on every specification route (403)', async () => {
    const up = await upload('butter', { reviewBy: isoDay(30) }, { name: 'spec.pdf', bytes: pdf }, counter);
    expect(up.statusCode).toBe(403);
    expect(up.json()).toMatchObject({ code: 'forbidden' });
    for (const url of ['/api/ingredients/ground-almonds/specifications', '/api/specifications/status', '/api/specifications/1/file']) {
      expect((await get(url, counter)).statusCode).toBe(403);
    }
  });

  it('serves the same bytes back, as an attachment, with the stored type and name', async () => {
    const created = (await upload('dark-chocolate', { reviewBy: isoDay(90) }, { name: 'Chocolat noir – fiche.pdf', bytes: pdf })).json();
    const res = await get(created.fileUrl);
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toBe(
      `attachment; filename="Chocolat noir _ fiche.pdf"; filename*=UTF-8''${encodeURIComponent('Chocolat noir – fiche.pdf')}`,
    );
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(sha256(res.rawPayload)).toBe(sha256(pdf));
    expect(sha256(res.rawPayload)).toBe(created.sha256);
    expect((await get('/api/specifications/999999/file')).statusCode).toBe(404);
    expect((await get('/api/specifications/abc/file')).statusCode).toBe(404);
  });

  it('reports for every ingredient whether its specification is missing, overdue or current', async () => {
    const eggs = (await upload('eggs', { reviewBy: isoDay(10) }, { name: 'eggs.png', bytes: png })).json();
    // A specification whose review date has passed since it was uploaded.
    await t.sequelize.query('UPDATE specifications SET review_by = ? WHERE id = ?', { replacements: [isoDay(-3), eggs.id] });

    const res = await get('/api/specifications/status');
    expect(res.statusCode).toBe(200);
    const status = res.json<
      {
        ingredient: string;
        name: string;
        state: string;
        latest: { id: number; version: number; reviewBy: string; uploadedAt: string } | null;
      }[]
    >();
    const books = (await get('/api/ingredients')).json<{ id: string; name: string }[]>();
    expect(status.map((s) => s.ingredient).sort()).toEqual(books.map((b) => b.id).sort());
    const of = (code: string) => status.find((s) => s.ingredient === code)!;
    expect(of('ground-almonds')).toEqual({
      ingredient: 'ground-almonds',
      name: books.find((b) => b.id === 'ground-almonds')!.name,
      latest: { id: expect.any(Number), version: 2, reviewBy: isoDay(365), uploadedAt: expect.any(String) },
      state: 'current',
    });
    expect(of('eggs')).toMatchObject({ state: 'overdue', latest: { id: eggs.id, version: 1, reviewBy: isoDay(-3) } });
    expect(of('butter')).toEqual({ ingredient: 'butter', name: expect.any(String), latest: null, state: 'missing' });

    const eggList = (await get('/api/ingredients/eggs/specifications')).json();
    expect(eggList).toEqual([expect.objectContaining({ id: eggs.id, current: true, reviewOverdue: true })]);
  });
});
