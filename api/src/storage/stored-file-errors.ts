import { AppError } from '../common/app-error';
import { FileStoreError, type FileStore } from './file-store';

const inWords = (err: unknown) => (err instanceof FileStoreError ? err.message : err instanceof Error ? err.message : String(err));

/** Puts the bytes in the store and answers their key; a store that fails refuses the write, in words, before its row is saved. */
export async function keepFile(store: FileStore, bytes: Buffer): Promise<string> {
  try {
    return await store.put(bytes);
  } catch (err) {
    throw new AppError('internal', `Nothing was saved: the file could not be kept. ${inWords(err)}`);
  }
}

/** The bytes a row names, checked against the row's own checksum too; a missing or damaged object is said in words. */
export async function readStoredFile(store: FileStore, key: string, sha256: string, what: string): Promise<Buffer> {
  if (key !== sha256) throw new AppError('internal', `The file of ${what} is kept under ${key}, but its checksum is ${sha256}.`);
  try {
    return await store.get(key);
  } catch (err) {
    throw new AppError('internal', `The file of ${what} cannot be read: ${inWords(err)}`);
  }
}
