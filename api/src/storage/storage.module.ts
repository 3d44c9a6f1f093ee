import { Inject, Module, type OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AppConfig } from '../config/config';
import { FILE_STORE, type FileStore } from './file-store';
import { closeFileStore, fileStoreFrom } from './file-store.factory';
import { FileReferencesRepository } from './file-references.repository';
import { StoredFiles } from './stored-files';

/**
 * The uploaded files' bytes (FILE_STORE: a folder or an S3-compatible bucket, by STORAGE), for
 * the features that keep files: supplier specifications and label runs' PDFs.
 */
@Module({
  providers: [
    {
      provide: FILE_STORE,
      inject: [ConfigService],
      useFactory: (config: ConfigService<AppConfig, true>): FileStore =>
        fileStoreFrom({
          STORAGE: config.get('STORAGE', { infer: true }),
          STORAGE_DIR: config.get('STORAGE_DIR', { infer: true }),
          S3_ENDPOINT: config.get('S3_ENDPOINT', { infer: true }),
          S3_BUCKET: config.get('S3_BUCKET', { infer: true }),
          S3_REGION: config.get('S3_REGION', { infer: true }),
          S3_ACCESS_KEY_ID: config.get('S3_ACCESS_KEY_ID', { infer: true }),
          S3_SECRET_ACCESS_KEY: config.get('S3_SECRET_ACCESS_KEY', { infer: true }),
          S3_FORCE_PATH_STYLE: config.get('S3_FORCE_PATH_STYLE', { infer: true }),
        }),
    },
    FileReferencesRepository,
    StoredFiles,
  ],
  exports: [FILE_STORE, StoredFiles],
})
export class StorageModule implements OnApplicationShutdown {
  constructor(@Inject(FILE_STORE) private readonly store: FileStore) {}

  onApplicationShutdown() {
    closeFileStore(this.store);
  }
}
