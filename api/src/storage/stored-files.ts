import { Inject, Injectable } from '@nestjs/common';
import { FILE_STORE, type FileStore } from './file-store';
import { FileReferencesRepository } from './file-references.repository';

/** Deletion of stored files, which the rows that name them guard. */
@Injectable()
export class StoredFiles {
  constructor(
    @Inject(FILE_STORE) private readonly store: FileStore,
    private readonly references: FileReferencesRepository,
  ) {}

  /**
   * Deletes the object only when no row names it any more (the same bytes uploaded twice are one
   * object); answers whether it was deleted. Run after the transaction that dropped the last
   * reference has committed, never inside it.
   */
  async deleteUnreferenced(key: string): Promise<boolean> {
    if (await this.references.isReferenced(key)) return false;
    await this.store.delete(key);
    return true;
  }
}
