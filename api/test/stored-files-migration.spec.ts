import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { migrator } from '../src/database/migrator';
import { LocalFileStore } from '../src/storage/local-file-store';
import { adminQuery, emptyOwnerDatabase } from './support/test-app';

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

/**
 * Migration 0014 moves the bytes of supplier specifications and label runs' PDFs out of the
 * database into the file store, keeping each row's checksum and the object's key, and refuses,
 * changing nothing, a row whose bytes no longer match its checksum.
 */
describe('migration 0014: uploaded files move from the database to the file store (real MariaDB)', () => {
  const database = `${process.env.DB_NAME}_files`;
  const dir = mkdtempSync(join(tmpdir(), 'crumbproof-test-uploads-migration-'));
  const store = new LocalFileStore(dir);
  let sequelize: Sequelize;
  const specBytes = Buffer.from('%PDF-1.4 the supplier specification of almond paste');
  const pdfBytes = Buffer.from('%PDF-1.4 twelve product labels');

  beforeAll(async () => {
    sequelize = await emptyOwnerDatabase(database);
    await migrator(sequelize).up({ to: '0013-book-version' });
    await sequelize.query(
      "INSERT INTO sites (name, address, regime, handles, created_at, updated_at) VALUES ('Migration kitchen', '', 'UK', '[]', NOW(3), NOW(3))",
    );
    await sequelize.query(
      "INSERT INTO users (email, name, role, password_hash, created_at, updated_at) VALUES ('chef@bakehouse.example', 'Chef', 'pastry-chef', 'x', NOW(3), NOW(3))",
    );
    await sequelize.query(
      "INSERT INTO ingredients (site_id, code, name, created_at, updated_at) VALUES (1, 'almond-paste', 'Almond paste', NOW(3), NOW(3))",
    );
    // Two versions with the same file: one object in the store.
    for (const version of [1, 2]) {
      await sequelize.query(
        "INSERT INTO specifications (ingredient_id, version, filename, media_type, size_bytes, sha256, content, review_by, created_at) VALUES (1, ?, 'almond.pdf', 'application/pdf', ?, ?, ?, '2027-01-01', NOW(3))",
        { replacements: [version, specBytes.length, sha256(specBytes), specBytes] },
      );
    }
    await sequelize.query(
      "INSERT INTO label_runs (site_id, printed_by, printed_by_name, template, production_date, request, items, sources, pdf, size_bytes, sha256, created_at) VALUES (1, 1, 'Chef', 'product', '2026-12-02', '{}', '[]', '[]', ?, ?, ?, NOW(3))",
      { replacements: [pdfBytes, pdfBytes.length, sha256(pdfBytes)] },
    );
  });
  afterAll(async () => {
    await sequelize.close();
    await adminQuery(`DROP DATABASE IF EXISTS \`${database}\``);
    rmSync(dir, { recursive: true, force: true });
  });

  const columns = async (table: string) => Object.keys(await sequelize.getQueryInterface().describeTable(table));

  it('refuses, changing nothing, a row whose bytes do not match the checksum kept with them', async () => {
    await sequelize.query("UPDATE label_runs SET sha256 = REPEAT('0', 64) WHERE id = 1");
    await expect(migrator(sequelize, undefined, store).up({ to: '0014-stored-files' })).rejects.toThrow(
      new RegExp(
        `The label run 1's stored bytes have the SHA-256 ${sha256(pdfBytes)}, not the 0{64} recorded with them.*Nothing was changed`,
      ),
    );
    expect(await columns('specifications')).toContain('content');
    expect(await columns('specifications')).not.toContain('storage_key');
    expect(await columns('label_runs')).toContain('pdf');
    expect(await store.has(sha256(specBytes))).toBe(false);
    expect((await migrator(sequelize).executed()).map((m) => m.name)).not.toContain('0014-stored-files');
  });

  it('puts every file in the store and keeps its key and checksum in the row', async () => {
    await sequelize.query('UPDATE label_runs SET sha256 = ? WHERE id = 1', { replacements: [sha256(pdfBytes)] });
    await migrator(sequelize, undefined, store).up({ to: '0014-stored-files' });
    expect(await columns('specifications')).not.toContain('content');
    expect(await columns('label_runs')).not.toContain('pdf');
    const rows = await sequelize.query<{ storage_key: string; sha256: string }>(
      'SELECT storage_key, sha256 FROM specifications UNION ALL SELECT storage_key, sha256 FROM label_runs',
      { type: QueryTypes.SELECT },
    );
    expect(rows).toEqual([
      { storage_key: sha256(specBytes), sha256: sha256(specBytes) },
      { storage_key: sha256(specBytes), sha256: sha256(specBytes) },
      { storage_key: sha256(pdfBytes), sha256: sha256(pdfBytes) },
    ]);
    expect((await store.get(sha256(specBytes))).equals(specBytes)).toBe(true);
    expect((await store.get(sha256(pdfBytes))).equals(pdfBytes)).toBe(true);
  });

  it('refuses, changing nothing, to undo without the file store the bytes are to come back from', async () => {
    await expect(migrator(sequelize).down()).rejects.toThrow(
      '3 uploaded file(s) are to come back from the file store, and no file store was given.',
    );
    expect(await columns('specifications')).toContain('storage_key');
    expect(await columns('specifications')).not.toContain('content');
    expect(await columns('label_runs')).not.toContain('pdf');
  });

  it('brings the bytes back into the rows when undone', async () => {
    await migrator(sequelize, undefined, store).down();
    const [run] = await sequelize.query<{ pdf: Buffer }>('SELECT pdf FROM label_runs WHERE id = 1', { type: QueryTypes.SELECT });
    expect(Buffer.from(run.pdf).equals(pdfBytes)).toBe(true);
    expect(await columns('specifications')).not.toContain('storage_key');
    await migrator(sequelize, undefined, store).up({ to: '0014-stored-files' });
    expect(await columns('specifications')).toContain('storage_key');
  });
});
