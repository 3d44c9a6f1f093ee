import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import S3rver from 's3rver';

/** A fake S3-compatible service (s3rver) on loopback, with one bucket, its objects in a folder of its own. */
export interface FakeS3 {
  endpoint: string;
  bucket: string;
  /** The app's settings for it, as `.env.example` names them. */
  settings: Record<string, string>;
  /** A client of its own, to read and change objects behind the app's back. */
  client: S3Client;
  /** The bytes of the object `sha256/<key>`, read straight from the bucket. */
  object(key: string): Promise<Buffer>;
  /** Writes other bytes under `sha256/<key>`. */
  overwrite(key: string, bytes: Buffer): Promise<void>;
  /** Deletes the object `sha256/<key>` behind the app's back. */
  remove(key: string): Promise<void>;
  /** Stops it (down) and starts it again on the same port (up), keeping its objects. */
  down(): Promise<void>;
  up(): Promise<void>;
  close(): Promise<void>;
}

export async function startFakeS3(bucket = 'crumbproof-uploads'): Promise<FakeS3> {
  const directory = mkdtempSync(join(tmpdir(), 'crumbproof-fake-s3-'));
  const make = (port: number) => new S3rver({ address: '127.0.0.1', port, silent: true, directory, configureBuckets: [{ name: bucket }] });
  let server = make(0);
  const { port } = await server.run();
  let running = true;
  const endpoint = `http://127.0.0.1:${port}`;
  const client = new S3Client({
    endpoint,
    region: 'us-east-1',
    forcePathStyle: true,
    credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
  });
  return {
    endpoint,
    bucket,
    client,
    async object(key) {
      const out = await client.send(new GetObjectCommand({ Bucket: bucket, Key: `sha256/${key}` }));
      return Buffer.from(await out.Body!.transformToByteArray());
    },
    async overwrite(key, bytes) {
      await client.send(new PutObjectCommand({ Bucket: bucket, Key: `sha256/${key}`, Body: bytes }));
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: `sha256/${key}` }));
    },
    settings: {
      STORAGE: 's3',
      S3_ENDPOINT: endpoint,
      S3_BUCKET: bucket,
      S3_REGION: 'us-east-1',
      S3_ACCESS_KEY_ID: 'S3RVER',
      S3_SECRET_ACCESS_KEY: 'S3RVER',
      S3_FORCE_PATH_STYLE: 'true',
    },
    async down() {
      if (running) await server.close();
      running = false;
    },
    async up() {
      if (running) return;
      server = make(port);
      await server.run();
      running = true;
    },
    async close() {
      client.destroy();
      if (running) await server.close();
      running = false;
      rmSync(directory, { recursive: true, force: true });
    },
  };
}
