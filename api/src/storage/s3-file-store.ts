import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
  type S3ClientConfig,
} from '@aws-sdk/client-s3';
import { checkKey, contentKey, FileStoreError, verified, type FileStore } from './file-store';

export interface S3Settings {
  endpoint?: string;
  bucket: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  forcePathStyle: boolean;
}

const isMissing = (err: unknown) =>
  err instanceof S3ServiceException && (err.name === 'NoSuchKey' || err.name === 'NotFound' || err.$metadata.httpStatusCode === 404);

/**
 * The object storage implementation (STORAGE=s3): one object per key, `sha256/<key>`, in
 * S3_BUCKET of an S3-compatible service (S3_ENDPOINT; AWS's own when unset). The bucket is the
 * operator's: Crumbproof creates none. Checksums beyond the content address are asked for only
 * where the service requires them, since S3-compatible services differ in the ones they accept;
 * every read is checked against its key here.
 */
export class S3FileStore implements FileStore {
  readonly kind = 's3' as const;
  private readonly client: S3Client;

  constructor(private readonly settings: S3Settings) {
    const config: S3ClientConfig = {
      region: settings.region,
      forcePathStyle: settings.forcePathStyle,
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
      ...(settings.endpoint ? { endpoint: settings.endpoint } : {}),
      ...(settings.accessKeyId && settings.secretAccessKey
        ? { credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey } }
        : {}),
    };
    this.client = new S3Client(config);
  }

  get where() {
    return `the bucket ${this.settings.bucket}${this.settings.endpoint ? ` at ${this.settings.endpoint}` : ''}`;
  }

  private objectKey(key: string) {
    return `sha256/${checkKey(key)}`;
  }

  private failed(what: string, err: unknown): FileStoreError {
    const why = err instanceof Error ? err.message.replace(/^AWS SDK error wrapper for /, '') : String(err);
    return new FileStoreError(`Could not ${what} in ${this.where}: ${why}`, 'unavailable', { cause: err });
  }

  async put(bytes: Buffer): Promise<string> {
    const key = contentKey(bytes);
    try {
      if (await this.has(key)) return key;
      await this.client.send(
        new PutObjectCommand({ Bucket: this.settings.bucket, Key: this.objectKey(key), Body: bytes, ContentLength: bytes.length }),
      );
    } catch (err) {
      throw this.failed(`keep the file ${key}`, err instanceof FileStoreError && err.cause ? err.cause : err);
    }
    return key;
  }

  async get(key: string): Promise<Buffer> {
    let bytes: Buffer;
    try {
      const out = await this.client.send(new GetObjectCommand({ Bucket: this.settings.bucket, Key: this.objectKey(key) }));
      bytes = Buffer.from(await out.Body!.transformToByteArray());
    } catch (err) {
      if (isMissing(err)) throw new FileStoreError(`The stored file ${key} is not in ${this.where}.`, 'missing');
      throw this.failed(`read the stored file ${key}`, err);
    }
    return verified(key, bytes, this.where);
  }

  async has(key: string): Promise<boolean> {
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.settings.bucket, Key: this.objectKey(key) }));
      return true;
    } catch (err) {
      if (isMissing(err)) return false;
      throw this.failed(`look for the stored file ${key}`, err);
    }
  }

  async delete(key: string): Promise<void> {
    try {
      await this.client.send(new DeleteObjectCommand({ Bucket: this.settings.bucket, Key: this.objectKey(key) }));
    } catch (err) {
      throw this.failed(`delete the stored file ${key}`, err);
    }
  }

  /** Closes the client's connections (the CLI and the tests end with it). */
  close() {
    this.client.destroy();
  }
}
