import { randomBytes } from 'node:crypto';
import { mkdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises';
import { dirname, join, resolve } from 'node:path';
import { checkKey, contentKey, FileStoreError, verified, type FileStore } from './file-store';

/**
 * The folder implementation (STORAGE=local, STORAGE_DIR): each object is a file named by its key
 * under two levels of folders (`ab/cd/abcd…`), written to a temporary name in the same folder
 * and renamed into place, so a reader never sees half a file.
 */
export class LocalFileStore implements FileStore {
  readonly kind = 'local' as const;
  readonly root: string;

  constructor(dir: string) {
    this.root = resolve(dir);
  }

  get where() {
    return `the folder ${this.root}`;
  }

  private path(key: string) {
    checkKey(key);
    return join(this.root, key.slice(0, 2), key.slice(2, 4), key);
  }

  /** The store cannot be used: its folder is not there (not mounted), or cannot be read or written. */
  private unavailable(what: string, err: unknown): FileStoreError {
    return new FileStoreError(`Could not ${what} in ${this.where}: ${(err as Error).message}`, 'unavailable', { cause: err });
  }

  async put(bytes: Buffer): Promise<string> {
    const key = contentKey(bytes);
    const target = this.path(key);
    if (await this.has(key)) return key;
    const partial = `${target}.${randomBytes(6).toString('hex')}.partial`;
    try {
      await mkdir(dirname(target), { recursive: true });
      await writeFile(partial, bytes, { flag: 'wx' });
      await rename(partial, target);
    } catch (err) {
      await rm(partial, { force: true }).catch(() => undefined);
      throw this.unavailable(`keep the file ${key}`, err);
    }
    return key;
  }

  async get(key: string): Promise<Buffer> {
    const path = this.path(key);
    let bytes: Buffer;
    try {
      bytes = await readFile(path);
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw this.unavailable(`read the stored file ${key}`, err);
      // With the folder itself gone (not mounted), every file would read as missing: the store is away, not the file.
      if (!(await this.rootIsThere())) {
        throw new FileStoreError(`Could not read the stored file ${key}: ${this.where} is not there (is it mounted?).`, 'unavailable');
      }
      throw new FileStoreError(`The stored file ${key} is not in ${this.where}.`, 'missing');
    }
    return verified(key, bytes, this.where);
  }

  async has(key: string): Promise<boolean> {
    const path = this.path(key);
    try {
      return (await stat(path)).isFile();
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return false;
      throw this.unavailable(`look for the stored file ${key}`, err);
    }
  }

  private async rootIsThere(): Promise<boolean> {
    try {
      return (await stat(this.root)).isDirectory();
    } catch {
      return false;
    }
  }

  async delete(key: string): Promise<void> {
    await rm(this.path(key), { force: true });
  }
}
