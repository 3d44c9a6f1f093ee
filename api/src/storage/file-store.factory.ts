import type { AppConfig } from '../config/config';
import type { FileStore } from './file-store';
import { LocalFileStore } from './local-file-store';
import { S3FileStore } from './s3-file-store';

/** The settings that name the store. */
export type StorageSettings = Pick<
  AppConfig,
  | 'STORAGE'
  | 'STORAGE_DIR'
  | 'S3_ENDPOINT'
  | 'S3_BUCKET'
  | 'S3_REGION'
  | 'S3_ACCESS_KEY_ID'
  | 'S3_SECRET_ACCESS_KEY'
  | 'S3_FORCE_PATH_STYLE'
>;

/** The store the settings name: the API, the migrations and the backup CLI all build theirs here. */
export function fileStoreFrom(config: StorageSettings): FileStore {
  if (config.STORAGE === 's3') {
    return new S3FileStore({
      endpoint: config.S3_ENDPOINT,
      bucket: config.S3_BUCKET!,
      region: config.S3_REGION,
      accessKeyId: config.S3_ACCESS_KEY_ID,
      secretAccessKey: config.S3_SECRET_ACCESS_KEY,
      forcePathStyle: config.S3_FORCE_PATH_STYLE === 'true',
    });
  }
  return new LocalFileStore(config.STORAGE_DIR);
}

/** Lets go of the store's connections, where it has any. */
export function closeFileStore(store: FileStore) {
  if (store instanceof S3FileStore) store.close();
}
