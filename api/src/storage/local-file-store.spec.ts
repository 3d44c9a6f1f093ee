import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { contentKey } from './file-store';
import { LocalFileStore } from './local-file-store';

describe('LocalFileStore', () => {
  let dir: string;
  let store: LocalFileStore;
  beforeEach(() => {
    dir = mkdtempSync(join(tmpdir(), 'crumbproof-store-spec-'));
    store = new LocalFileStore(dir);
  });
  afterEach(() => rmSync(dir, { recursive: true, force: true }));

  const bytes = Buffer.from('%PDF-1.4 a specification');
  const key = contentKey(bytes);

  it('keeps bytes under their SHA-256, once however often they are put', async () => {
    expect(await store.put(bytes)).toBe(key);
    expect(await store.put(Buffer.from(bytes))).toBe(key);
    expect((await store.get(key)).equals(bytes)).toBe(true);
    expect(readdirSync(join(dir, key.slice(0, 2), key.slice(2, 4)))).toEqual([key]);
    expect(await store.has(key)).toBe(true);
  });

  it('says a missing object is missing, and refuses one whose bytes changed', async () => {
    await expect(store.get(contentKey(Buffer.from('never put')))).rejects.toMatchObject({
      missing: true,
      reason: 'missing',
      message: /is not in the folder/,
    });
    await store.put(bytes);
    writeFileSync(join(dir, key.slice(0, 2), key.slice(2, 4), key), 'changed');
    await expect(store.get(key)).rejects.toMatchObject({
      reason: 'damaged',
      message: expect.stringMatching(
        new RegExp(`The stored file ${key} in the folder .* is damaged: its bytes have the SHA-256 ${contentKey(Buffer.from('changed'))}`),
      ),
    });
  });

  it('says the store cannot be used, not that a file is missing, when its folder is not there or cannot be written', async () => {
    await store.put(bytes);
    rmSync(dir, { recursive: true, force: true });
    await expect(store.get(key)).rejects.toMatchObject({
      reason: 'unavailable',
      message: expect.stringMatching(/^Could not read the stored file [0-9a-f]{64}: the folder .* is not there \(is it mounted\?\)\.$/),
    });
    // A file where the folder should be: nothing can be kept under it, nor looked for.
    writeFileSync(dir, 'not a folder');
    await expect(store.put(bytes)).rejects.toMatchObject({
      reason: 'unavailable',
      message: expect.stringMatching(new RegExp(`^Could not look for the stored file ${key} in the folder `)),
    });
    await expect(store.get(key)).rejects.toMatchObject({ reason: 'unavailable' });
    rmSync(dir, { force: true });
  });

  it.each(['../../etc/passwd', 'ABC', `${key}/x`, key.toUpperCase()])('refuses the key %s, which is no content address', async (bad) => {
    await expect(store.get(bad)).rejects.toThrow(/is not a stored file's key/);
    await expect(store.delete(bad)).rejects.toThrow(/is not a stored file's key/);
  });

  it('deletes an object', async () => {
    await store.put(bytes);
    await store.delete(key);
    expect(await store.has(key)).toBe(false);
  });
});
