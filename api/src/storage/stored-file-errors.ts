import { Logger } from '@nestjs/common';
import { AppError } from '../common/app-error';
import { FileStoreError, type FileStore } from './file-store';

const logger = new Logger('Storage');

const inWords = (err: unknown) => (err instanceof Error ? err.message : String(err));

/** What every upload and file read answers, after the reason, while the store cannot be used (503, storage-unavailable). */
export const STORAGE_UNAVAILABLE_ADVICE =
  'Crumbproof cannot reach its file store just now. Try again in a moment; if it keeps happening, the object storage (or the uploads folder) needs looking at.';

/** The store cannot be used: one line in the log, no stack, as for the database. */
function storageUnavailable(message: string, err: unknown): AppError {
  logger.warn(`The file store cannot be used: ${inWords(err)}`);
  return new AppError('storage-unavailable', `${message} ${STORAGE_UNAVAILABLE_ADVICE}`);
}

/**
 * Puts the bytes in the store and answers their key. A store that cannot be used refuses the
 * write (503 storage-unavailable), in words, before its row is saved: nothing is saved.
 */
export async function keepFile(store: FileStore, bytes: Buffer): Promise<string> {
  try {
    return await store.put(bytes);
  } catch (err) {
    throw storageUnavailable(`Nothing was saved: the file could not be kept. ${inWords(err)}`, err);
  }
}

/**
 * The bytes a row names, checked against the row's own checksum too. A store that cannot be used
 * answers 503 storage-unavailable; a file missing from the store (stored-file-missing) or whose
 * bytes no longer match (stored-file-damaged) is said in words naming `what` and the file, never served.
 */
export async function readStoredFile(store: FileStore, key: string, sha256: string, what: string): Promise<Buffer> {
  if (key !== sha256) {
    throw new AppError('stored-file-damaged', `The file of ${what} is kept under ${key}, but its checksum is ${sha256}: it is not served.`);
  }
  try {
    return await store.get(key);
  } catch (err) {
    const reason = err instanceof FileStoreError ? err.reason : 'unavailable';
    if (reason === 'missing') {
      throw new AppError(
        'stored-file-missing',
        `The file of ${what} is missing from the file store: ${inWords(err)} Restore it from a backup.`,
      );
    }
    if (reason === 'damaged' || reason === 'bad-key') {
      throw new AppError('stored-file-damaged', `The file of ${what} is not served: ${inWords(err)}`);
    }
    throw storageUnavailable(`The file of ${what} cannot be read just now. ${inWords(err)}`, err);
  }
}
