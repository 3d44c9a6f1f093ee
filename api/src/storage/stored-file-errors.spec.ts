import { Logger } from '@nestjs/common';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { httpStatusOf } from '../common/app-error';
import { contentKey } from './file-store';
import { LocalFileStore } from './local-file-store';
import { keepFile, readStoredFile } from './stored-file-errors';

/** How uploads and file reads answer a folder store that cannot be used, and a file missing or damaged in it. */
describe('keepFile and readStoredFile over the uploads folder', () => {
  let dir: string;
  let store: LocalFileStore;
  beforeEach(() => {
    dir = mkdtempSync(join(tmpdir(), 'crumbproof-stored-file-errors-'));
    store = new LocalFileStore(dir);
    jest.spyOn(Logger.prototype, 'warn').mockImplementation(() => undefined);
  });
  afterEach(() => {
    jest.restoreAllMocks();
    rmSync(dir, { recursive: true, force: true });
  });

  const bytes = Buffer.from('%PDF-1.4 a supplier specification');
  const key = contentKey(bytes);

  it('refuses an upload with 503 storage-unavailable when the folder cannot be written', async () => {
    rmSync(dir, { recursive: true });
    writeFileSync(dir, 'a file where the uploads folder should be');
    const refused = await keepFile(store, bytes).catch((e: unknown) => e);
    expect(refused).toMatchObject({
      code: 'storage-unavailable',
      message: expect.stringMatching(/^Nothing was saved: the file could not be kept\. /),
    });
    expect(httpStatusOf('storage-unavailable')).toBe(503);
    rmSync(dir, { force: true });
  });

  it('answers 503 storage-unavailable for a read while the folder is not there, and stored-file-missing for one file gone', async () => {
    await keepFile(store, bytes);
    const other = Buffer.from('%PDF-1.4 another one');
    const otherKey = await keepFile(store, other);
    rmSync(join(dir, otherKey.slice(0, 2)), { recursive: true });
    await expect(readStoredFile(store, otherKey, otherKey, 'specification 2 (sugar.pdf)')).rejects.toMatchObject({
      code: 'stored-file-missing',
      message: expect.stringMatching(
        /^The file of specification 2 \(sugar\.pdf\) is missing from the file store: The stored file [0-9a-f]{64} is not in the folder /,
      ),
    });
    rmSync(dir, { recursive: true });
    await expect(readStoredFile(store, key, key, 'specification 1 (flour.pdf)')).rejects.toMatchObject({
      code: 'storage-unavailable',
      message: expect.stringMatching(
        /^The file of specification 1 \(flour\.pdf\) cannot be read just now\. .* is not there \(is it mounted\?\)/,
      ),
    });
  });

  it('answers stored-file-damaged for bytes changed in the folder, and for a row whose key is not its checksum', async () => {
    await keepFile(store, bytes);
    writeFileSync(join(dir, key.slice(0, 2), key.slice(2, 4), key), 'changed');
    await expect(readStoredFile(store, key, key, 'the PDF of print run 4')).rejects.toMatchObject({
      code: 'stored-file-damaged',
      message: expect.stringMatching(
        /^The file of the PDF of print run 4 is not served: The stored file [0-9a-f]{64} in the folder .* is damaged/,
      ),
    });
    const other = contentKey(Buffer.from('other'));
    await expect(readStoredFile(store, key, other, 'the PDF of print run 5')).rejects.toMatchObject({ code: 'stored-file-damaged' });
    expect([httpStatusOf('stored-file-damaged'), httpStatusOf('stored-file-missing')]).toEqual([500, 500]);
  });
});
