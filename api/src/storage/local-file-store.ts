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

  async put(bytes: Buffer): Promise<string> {
    const key = contentKey(bytes);
    const target = this.path(key);
    if (await this.has(key)) return key;
    await mkdir(dirname(target), { recursive: true });
    const partial = `${target}.${randomBytes(6).toString('hex')}.partial`;
    try {
      await writeFile(partial, bytes, { flag: 'wx' });
      await rename(partial, target);
    } catch (err) {
      await rm(partial, { force: true });
      throw new FileStoreError(`Could not keep a file in ${this.where}: ${(err as Error).message}`, false, { cause: err });
    }
    return key;
  }

  async get(key: string): Promise<Buffer> {
    const path = this.path(key);
    let bytes: Buffer;
    try {
      bytes = await readFile(path);
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT')
        throw new FileStoreError(`The stored file ${key} is not in ${this.where}.`, true);
      throw new FileStoreError(`Could not read the stored file ${key} in ${this.where}: ${(err as Error).message}`, false, { cause: err });
    }
    return verified(key, bytes, this.where);
  }

  async has(key: string): Promise<boolean> {
    try {
      return (await stat(this.path(key))).isFile();
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return false;
      throw err;
    }
  }

  async delete(key: string): Promise<void> {
    await rm(this.path(key), { force: true });
  }
}
