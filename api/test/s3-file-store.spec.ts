import { contentKey } from '../src/storage/file-store';
import { S3FileStore } from '../src/storage/s3-file-store';
import { startFakeS3, type FakeS3 } from './support/fake-s3';

/** The object storage implementation against a fake S3-compatible server (s3rver on loopback). */
describe('S3FileStore (fake S3)', () => {
  let s3: FakeS3;
  let store: S3FileStore;
  const settings = (fake: FakeS3, bucket = fake.bucket) => ({
    endpoint: fake.endpoint,
    bucket,
    region: 'us-east-1',
    accessKeyId: 'S3RVER',
    secretAccessKey: 'S3RVER',
    forcePathStyle: true,
  });

  beforeAll(async () => {
    s3 = await startFakeS3();
    store = new S3FileStore(settings(s3));
  });
  afterAll(async () => {
    store?.close();
    await s3?.close();
  });

  const bytes = Buffer.from('%PDF-1.4 the specification of ground almonds');
  const key = contentKey(bytes);

  it('keeps bytes under sha256/<their SHA-256>, once however often they are put, and reads them back', async () => {
    expect(await store.has(key)).toBe(false);
    expect(await store.put(bytes)).toBe(key);
    expect(await store.put(Buffer.from(bytes))).toBe(key);
    expect((await s3.object(key)).equals(bytes)).toBe(true);
    expect((await store.get(key)).equals(bytes)).toBe(true);
    expect(await store.has(key)).toBe(true);
  });

  it('says a missing object is missing, and refuses one whose bytes changed in the bucket', async () => {
    await expect(store.get(contentKey(Buffer.from('never put')))).rejects.toMatchObject({
      missing: true,
      reason: 'missing',
      message: expect.stringMatching(/is not in the bucket crumbproof-uploads at http:\/\/127\.0\.0\.1:\d+/),
    });
    const other = Buffer.from('%PDF-1.4 a label run');
    const otherKey = await store.put(other);
    await s3.overwrite(otherKey, Buffer.from('changed'));
    await expect(store.get(otherKey)).rejects.toThrow(
      new RegExp(
        `The stored file ${otherKey} in the bucket .* is damaged: its bytes have the SHA-256 ${contentKey(Buffer.from('changed'))}`,
      ),
    );
  });

  it.each(['../../etc/passwd', 'ABC', `${key}/x`, key.toUpperCase()])('refuses the key %s, which is no content address', async (bad) => {
    await expect(store.get(bad)).rejects.toThrow(/is not a stored file's key/);
    await expect(store.delete(bad)).rejects.toThrow(/is not a stored file's key/);
  });

  it('deletes an object', async () => {
    const gone = Buffer.from('%PDF-1.4 to be deleted');
    const goneKey = await store.put(gone);
    await store.delete(goneKey);
    expect(await store.has(goneKey)).toBe(false);
  });

  it('says in words when the bucket does not exist or the service cannot be reached', async () => {
    const noBucket = new S3FileStore(settings(s3, 'no-such-bucket'));
    try {
      await expect(noBucket.put(Buffer.from('x'))).rejects.toThrow(
        /^Could not keep the file [0-9a-f]{64} in the bucket no-such-bucket at /,
      );
    } finally {
      noBucket.close();
    }
    await s3.down();
    try {
      await expect(store.get(key)).rejects.toMatchObject({
        missing: false,
        reason: 'unavailable',
        message: expect.stringMatching(new RegExp(`^Could not read the stored file ${key} in the bucket crumbproof-uploads`)),
      });
    } finally {
      await s3.up();
    }
    expect((await store.get(key)).equals(bytes)).toBe(true);
  });
});
