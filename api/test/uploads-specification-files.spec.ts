import { fixture, multipart, type FormFile } from './fixtures/forms';
import type { TestApp } from './support/test-app';

const isoDay = (offsetDays: number) => {
  const d = new Date();
  d.setDate(d.getDate() + offsetDays);
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
};

const pdf = fixture('almond-paste-spec.pdf');
const png = fixture('label-photo.png');
/** The start of a JPEG/JFIF file (SOI and APP0 markers, ITU-T T.81 and JFIF 1.02): enough to be detected as one. */
const jpeg = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0x01, 0x00, 0x00, 0x01, 0x00, 0x01]);
/** A PDF of exactly this many bytes (the fixture, padded with spaces after its end). */
const pdfOf = (bytes: number) => Buffer.concat([pdf, Buffer.alloc(bytes - pdf.length, 0x20)]);

/** Every bidirectional control of Unicode (UAX #9: embeddings, overrides, isolates, marks). */
const BIDI = ['\u202a', '\u202b', '\u202c', '\u202d', '\u202e', '\u2066', '\u2067', '\u2068', '\u2069', '\u200e', '\u200f'];

describe('served specification files and the kitchen storage limit (real MariaDB)', () => {
  let t: TestApp;
  let chef: string;

  beforeAll(async () => {
    // A limit of 1 MB for this file's kitchen; the setting is read when the app starts.
    process.env.KITCHEN_FILE_QUOTA_MB = '1';
    const { startTestApp } = await import('./support/test-app');
    t = await startTestApp({ seed: true });
    chef = await t.signIn('chef@example.com');
  });
  afterAll(() => t.close());

  const upload = async (code: string, file: FormFile) => {
    const form = await multipart({ reviewBy: isoDay(30) }, file);
    return t.app.inject({
      method: 'POST',
      url: `/api/ingredients/${code}/specifications`,
      payload: form.payload,
      headers: { ...form.headers, cookie: chef },
    });
  };
  const get = (url: string) => t.app.inject({ method: 'GET', url, headers: { cookie: chef } });
  const stored = async () =>
    ((await t.sequelize.query('SELECT COUNT(*) AS n, COALESCE(SUM(size_bytes), 0) AS bytes FROM specifications', {
      plain: true,
    })) as { n: number | bigint; bytes: number | string }) ?? { n: 0, bytes: 0 };
  const storedNow = async () => {
    const s = await stored();
    return { n: Number(s.n), bytes: Number(s.bytes) };
  };

  it.each([
    { sent: 'spec.png', bytes: pdf, served: 'spec.pdf' },
    { sent: 'label', bytes: png, served: 'label.png' },
    { sent: 'Label.PNG', bytes: png, served: 'Label.PNG' },
    { sent: 'crate photo.jpeg', bytes: jpeg, served: 'crate photo.jpeg' },
    { sent: 'crate photo.html', bytes: jpeg, served: 'crate photo.jpg' },
    { sent: 'version 1.2', bytes: pdf, served: 'version 1.2.pdf' },
  ])('a file sent as $sent is kept and served as $served, the extension of its detected type', async ({ sent, bytes, served }) => {
    const created = await upload('butter', { name: sent, bytes });
    expect(created.statusCode).toBe(201);
    expect(created.json().filename).toBe(served);
    const res = await get(created.json().fileUrl);
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-disposition']).toBe(`attachment; filename="${served}"; filename*=UTF-8''${encodeURIComponent(served)}`);
  });

  it('serves each file as an attachment, sandboxed, never sniffed, with the type found at upload', async () => {
    const created = (await upload('eggs', { name: 'eggs.pdf', bytes: pdf, type: 'text/html' })).json();
    const res = await get(created.fileUrl);
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(/^attachment; /);
    expect(res.headers['content-security-policy']).toBe('sandbox');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.rawPayload.equals(pdf)).toBe(true);
  });

  it('takes bidirectional and other control characters out of the name, so it reads as what it is', async () => {
    // "invoice<RLO>gnp.exe" shows as "invoiceexe.png" in a right-to-left override.
    const spoof = await upload('walnuts', { name: 'invoice\u202egnp.exe', bytes: png });
    expect(spoof.statusCode).toBe(201);
    expect(spoof.json().filename).toBe('invoicegnp.png');

    const every = await upload('walnuts', { name: `a${BIDI.join('b')}c\u0001\u007f\u0085\u009b d.pdf`, bytes: pdf });
    expect(every.statusCode).toBe(201);
    expect(every.json().filename).toBe(`a${'b'.repeat(BIDI.length - 1)}c d.pdf`);
    const res = await get(every.json().fileUrl);
    expect(decodeURIComponent(/filename\*=UTF-8''(.*)$/.exec(res.headers['content-disposition'] as string)![1])).toBe(
      `a${'b'.repeat(BIDI.length - 1)}c d.pdf`,
    );
  });

  it('serves a name stored before these rules without its control characters and with the right extension', async () => {
    const created = (await upload('yeast', { name: 'yeast.pdf', bytes: pdf })).json();
    await t.sequelize.query('UPDATE specifications SET filename = ? WHERE id = ?', {
      replacements: ['yeast\u202e\u2066fdp.html', created.id],
    });
    const res = await get(created.fileUrl);
    expect(res.headers['content-disposition']).toBe(`attachment; filename="yeastfdp.pdf"; filename*=UTF-8''yeastfdp.pdf`);
  });

  it("refuses an upload that would take the kitchen's files past its storage limit, saving nothing", async () => {
    const before = await storedNow();
    const room = 1024 * 1024 - before.bytes;
    expect(room).toBeGreaterThan(10_000);

    const tooMuch = await upload('ground-almonds', { name: 'scan.pdf', bytes: pdfOf(room + 1) });
    expect(tooMuch.statusCode).toBe(413);
    expect(tooMuch.json()).toMatchObject({
      code: 'too-large',
      message: expect.stringMatching(/^Nothing was saved: the kitchen's specification files may take at most 1 MB in all/),
      fields: [{ path: 'file', message: expect.stringMatching(/1 MB/) }],
    });
    expect(await storedNow()).toEqual(before);
    expect((await get('/api/ingredients/ground-almonds/specifications')).json()).toEqual([]);

    const exactly = await upload('ground-almonds', { name: 'scan.pdf', bytes: pdfOf(room) });
    expect(exactly.statusCode).toBe(201);
    expect((await storedNow()).bytes).toBe(1024 * 1024);

    const onMore = await upload('dark-chocolate', { name: 'tiny.png', bytes: png });
    expect(onMore.statusCode).toBe(413);
    expect(onMore.json().message).toMatch(/take 1 MB already/);
  });
});
