import { createHash } from 'node:crypto';
import { readdirSync } from 'node:fs';
import { labelRunSchema, type SpecificationView } from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { StoredFiles } from '../src/storage/stored-files';
import { fixture, multipart } from './fixtures/forms';
import { startFakeS3, type FakeS3 } from './support/fake-s3';
import { startTestApp, type TestApp } from './support/test-app';

const sha256 = (b: Buffer | Uint8Array) => createHash('sha256').update(b).digest('hex');

/**
 * STORAGE=s3 against a fake S3-compatible server started here (s3rver on loopback): a supplier
 * specification and a label run's PDF go into the bucket, by their SHA-256, and come back the
 * same; the local folder stays empty; an object changed in the bucket is refused, not served, and
 * one missing from it is said to be missing; and while the service is down an upload is refused
 * with nothing saved and a file read answers 503 storage-unavailable, both in words.
 */
describe('uploaded files in S3-compatible object storage (real MariaDB, fake S3)', () => {
  let s3: FakeS3;
  let t: TestApp;
  let chef: string;
  const pdf = fixture('almond-paste-spec.pdf');

  beforeAll(async () => {
    s3 = await startFakeS3();
    t = await startTestApp({ seed: true, settings: s3.settings });
    ({ chef } = await t.signInDemo());
  });
  afterAll(async () => {
    await t?.close();
    await s3?.close();
  });

  const object = (key: string) => s3.object(key);
  /** Uploads a specification of the ingredient: the fixture's PDF, or other bytes. */
  const upload = async (code: string, bytes = pdf) => {
    const form = await multipart({ note: 'Kept in the bucket' }, { name: `${code}.pdf`, bytes, type: 'application/pdf' });
    return t.app.inject({
      method: 'POST',
      url: `/api/ingredients/${code}/specifications`,
      payload: form.payload,
      headers: { ...form.headers, cookie: chef },
    });
  };
  const count = async (table: string) =>
    Number((await t.sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${table}\``, { type: QueryTypes.SELECT, plain: true }))!.n);

  it('keeps a specification in the bucket under its SHA-256 and downloads the same bytes', async () => {
    const res = await upload('ground-almonds');
    expect(res.statusCode).toBe(201);
    const spec = res.json<SpecificationView>();
    expect(spec.sha256).toBe(sha256(pdf));
    expect(sha256(await object(spec.sha256))).toBe(spec.sha256);
    const [row] = await t.sequelize.query<{ storage_key: string; sha256: string }>(
      'SELECT storage_key, sha256 FROM specifications WHERE id = ?',
      { replacements: [spec.id], type: QueryTypes.SELECT },
    );
    expect(row).toEqual({ storage_key: spec.sha256, sha256: spec.sha256 });

    const file = await t.req('GET', spec.fileUrl, chef);
    expect(file.statusCode).toBe(200);
    expect(file.rawPayload.equals(pdf)).toBe(true);
    // Nothing went to the local folder.
    expect(readdirSync(process.env.STORAGE_DIR!)).toEqual([]);
  });

  it('keeps a label run’s PDF in the bucket and downloads it from the print log', async () => {
    const res = await t.req('POST', '/api/labels/runs', chef, {
      template: 'product',
      items: [{ product: 'vegan-brownie', quantity: 2 }],
      productionDate: '2026-12-02',
    });
    expect(res.statusCode).toBe(201);
    const run = labelRunSchema.parse(res.json());
    const kept = await object(run.sha256);
    expect(sha256(kept)).toBe(run.sha256);
    const download = await t.req('GET', `/api/labels/runs/${run.id}/pdf`, chef);
    expect(download.statusCode).toBe(200);
    expect(download.rawPayload.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(download.rawPayload.equals(kept)).toBe(true);
  });

  it('keeps the same bytes once for two rows, and never deletes an object a row still names', async () => {
    const first = (await upload('ground-almonds')).json<SpecificationView>();
    const again = (await upload('icing-sugar')).json<SpecificationView>();
    expect(again.sha256).toBe(first.sha256);
    const files = t.app.get(StoredFiles);
    expect(await files.deleteUnreferenced(first.sha256)).toBe(false);
    expect((await object(first.sha256)).equals(pdf)).toBe(true);
    // An object no row names (a rolled-back upload's) may go.
    const orphan = Buffer.from('%PDF-1.4 an upload whose transaction rolled back');
    await s3.overwrite(sha256(orphan), orphan);
    expect(await files.deleteUnreferenced(sha256(orphan))).toBe(true);
    await expect(object(sha256(orphan))).rejects.toMatchObject({ name: 'NoSuchKey' });
  });

  it('refuses to serve an object whose bytes were changed in the bucket', async () => {
    const spec = (await upload('butter')).json<SpecificationView>();
    await s3.overwrite(spec.sha256, Buffer.from('not the file'));
    const file = await t.req('GET', spec.fileUrl, chef);
    expect(file.statusCode).toBe(500);
    expect(file.json()).toMatchObject({ statusCode: 500, code: 'stored-file-damaged' });
    expect(file.json().message).toMatch(
      new RegExp(
        `^The file of specification ${spec.id} \\(${spec.filename}\\) is not served: The stored file ${spec.sha256} in the bucket crumbproof-uploads .* is damaged`,
      ),
    );
    await s3.overwrite(spec.sha256, pdf);
    expect((await t.req('GET', spec.fileUrl, chef)).rawPayload.equals(pdf)).toBe(true);
  });

  it('refuses an upload while the object storage cannot be reached, saving nothing', async () => {
    const before = { specifications: await count('specifications'), audit: await count('audit_events') };
    await s3.down();
    try {
      const res = await upload('caster-sugar', Buffer.concat([pdf, Buffer.from('\n% another copy\n')]));
      expect(res.statusCode).toBe(503);
      expect(res.json()).toMatchObject({ statusCode: 503, code: 'storage-unavailable' });
      expect(res.json().message).toMatch(
        /^Nothing was saved: the file could not be kept\. Could not keep the file [0-9a-f]{64} in the bucket crumbproof-uploads at .*Crumbproof cannot reach its file store just now\. Try again in a moment/,
      );
    } finally {
      await s3.up();
    }
    expect({ specifications: await count('specifications'), audit: await count('audit_events') }).toEqual(before);
  });

  it('answers 503 storage-unavailable in words for a file read while the object storage cannot be reached, and serves it again after', async () => {
    const spec = (await upload('ground-almonds')).json<SpecificationView>();
    const run = await t.req('POST', '/api/labels/runs', chef, {
      template: 'product',
      items: [{ product: 'vegan-brownie', quantity: 1 }],
      productionDate: '2026-12-03',
    });
    expect(run.statusCode).toBe(201);
    const runId = labelRunSchema.parse(run.json()).id;
    await s3.down();
    try {
      const file = await t.req('GET', spec.fileUrl, chef);
      expect(file.statusCode).toBe(503);
      expect(file.json()).toMatchObject({ statusCode: 503, code: 'storage-unavailable' });
      expect(file.json().message).toMatch(
        new RegExp(
          `^The file of specification ${spec.id} \\(${spec.filename}\\) cannot be read just now\\. Could not read the stored file ${spec.sha256} in the bucket crumbproof-uploads at .*Crumbproof cannot reach its file store just now`,
        ),
      );
      const printed = await t.req('GET', `/api/labels/runs/${runId}/pdf`, chef);
      expect(printed.statusCode).toBe(503);
      expect(printed.json()).toMatchObject({ code: 'storage-unavailable' });
      expect(printed.json().message).toMatch(new RegExp(`^The file of the PDF of print run ${runId} cannot be read just now\\.`));
      // Nothing internal: no stack, no SDK's class names.
      expect(file.body).not.toMatch(/\bat [\w.]+ \(|S3ServiceException|stack/);
    } finally {
      await s3.up();
    }
    expect((await t.req('GET', spec.fileUrl, chef)).rawPayload.equals(pdf)).toBe(true);
    expect((await t.req('GET', `/api/labels/runs/${runId}/pdf`, chef)).statusCode).toBe(200);
  });

  it('says in words, apart from an outage, that a stored file is missing from the bucket, naming it', async () => {
    const own = Buffer.concat([pdf, Buffer.from('\n% a copy to lose\n')]);
    const res = await upload('butter', own);
    expect(res.statusCode).toBe(201);
    const spec = res.json<SpecificationView>();
    await s3.remove(spec.sha256);
    const file = await t.req('GET', spec.fileUrl, chef);
    expect(file.statusCode).toBe(500);
    expect(file.json()).toEqual({
      statusCode: 500,
      code: 'stored-file-missing',
      message: expect.stringMatching(
        new RegExp(
          `^The file of specification ${spec.id} \\(${spec.filename}\\) is missing from the file store: The stored file ${spec.sha256} is not in the bucket crumbproof-uploads at .*\\. Restore it from a backup\\.$`,
        ),
      ),
    });
    await s3.overwrite(spec.sha256, own);
    expect((await t.req('GET', spec.fileUrl, chef)).rawPayload.equals(own)).toBe(true);
  });
});
