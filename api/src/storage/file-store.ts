import { createHash } from 'node:crypto';

/**
 * Where uploaded files' bytes are kept: a folder on this machine (STORAGE=local) or an
 * S3-compatible bucket (STORAGE=s3). Every object is named by its content address, the SHA-256
 * of its bytes in hex, so the same bytes are one object however many rows name them, a put is
 * idempotent, and an object is never overwritten with other bytes. A write puts its object before
 * its row's transaction commits: a rollback then leaves an object no row names, which takes space
 * and nothing else (the next put of the same bytes finds it), while a committed row always names
 * an object that is there.
 */
export interface FileStore {
  /** Which implementation, for messages: `local` or `s3`. */
  readonly kind: 'local' | 's3';
  /** Where, in words: the folder, or the bucket and endpoint. */
  readonly where: string;
  /** Keeps the bytes and answers their key (their SHA-256); a second put of the same bytes stores nothing new. */
  put(bytes: Buffer): Promise<string>;
  /** The bytes of a key, checked against it: refuses a missing object and one whose bytes no longer match. */
  get(key: string): Promise<Buffer>;
  /** Whether an object is kept under the key. */
  has(key: string): Promise<boolean>;
  /**
   * Removes the object. Callers go through `StoredFiles.deleteUnreferenced`, which never deletes
   * an object that a row still names.
   */
  delete(key: string): Promise<void>;
}

/** The token under which Nest provides the app's FileStore. */
export const FILE_STORE = Symbol('FileStore');

const KEY = /^[0-9a-f]{64}$/;

/** The content address of some bytes: their SHA-256 in lower-case hex. */
export function contentKey(bytes: Buffer): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** Refuses anything but a content address, so a key can never name a path or object outside the store. */
export function checkKey(key: string): string {
  if (!KEY.test(key)) throw new FileStoreError(`'${key.slice(0, 80)}' is not a stored file's key (64 hex digits of SHA-256).`, 'bad-key');
  return key;
}

/** The bytes read back, refused when they are not the bytes the key was made from. */
export function verified(key: string, bytes: Buffer, where: string): Buffer {
  const actual = contentKey(bytes);
  if (actual !== key) {
    throw new FileStoreError(
      `The stored file ${key} in ${where} is damaged: its bytes have the SHA-256 ${actual}. Restore it from a backup (npm run restore).`,
      'damaged',
    );
  }
  return bytes;
}

/**
 * Why the store refused: a key that is no content address, an object that is not there, one whose
 * bytes no longer match its key, or a store that cannot be reached or used (the service down, the
 * bucket or folder not there, access refused, a full disk).
 */
export type FileStoreFailure = 'bad-key' | 'missing' | 'damaged' | 'unavailable';

/** A refusal of the store, in words, with its reason. */
export class FileStoreError extends Error {
  /** Whether the object is not in the store (the store itself answered). */
  readonly missing: boolean;

  constructor(
    message: string,
    readonly reason: FileStoreFailure,
    options?: ErrorOptions,
  ) {
    super(message, options);
    this.name = 'FileStoreError';
    this.missing = reason === 'missing';
  }
}
