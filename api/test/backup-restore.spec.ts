import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { copyFileSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { labelRunSchema, type LabelRun, type SpecificationView } from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { create as createTar, extract, list } from 'tar';
import { freePort, type instance } from '../scripts/lib/mariadb.mjs';
import { DeleteObjectCommand } from '@aws-sdk/client-s3';
import { backUp } from '../src/backup/back-up';
import { manifestSchema, type Manifest } from '../src/backup/backup-archive';
import { restore } from '../src/backup/restore';
import { parseBackupSettings } from '../src/config/config';
import { knownMigrations } from '../src/database/migrator';
import { fixture, multipart } from './fixtures/forms';
import { tableChecksums } from './fixtures/table-checksums';
import { startFakeS3 } from './support/fake-s3';
import { startOwnMariadb } from './support/own-mariadb';
import { startTestApp, type TestApp } from './support/test-app';

const ROOT = join(__dirname, '..', '..');
const sha256 = (b: Buffer | Uint8Array) => createHash('sha256').update(b).digest('hex');
const NOTHING_CHANGED = 'Nothing was restored: the database and the file store are as they were.';

/** Every file under a folder, by its path inside it. */
function filesUnder(dir: string, prefix = ''): string[] {
  return readdirSync(join(dir, prefix), { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? filesUnder(dir, join(prefix, e.name)) : [join(prefix, e.name)],
  );
}

/** npm run backup / npm run restore as a kitchen runs them, on the database the environment names. */
function command(name: 'backup' | 'restore', args: string[]) {
  const run = spawnSync('node', [join(ROOT, 'api', 'scripts', `${name}.mjs`), ...args], {
    cwd: ROOT,
    encoding: 'utf8',
    env: { ...process.env, INIT_CWD: ROOT },
    timeout: 60_000,
  });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

/**
 * A kitchen with uploaded files (supplier specifications and a label run's PDF), built through
 * the API on a MariaDB of its own, backed up with `npm run backup`; then a fresh, empty MariaDB
 * (a new data folder on the same address) and an empty uploads folder: bad archives are refused
 * there with nothing changed, the good one is restored with `npm run restore`, and the API over
 * it exports the same book and serves every upload with the same bytes; a second restore over the
 * restored kitchen is refused.
 */
describe('backups that restore (MariaDB instances of their own)', () => {
  const dir = mkdtempSync(join(tmpdir(), 'crumbproof-backup-spec-'));
  const uploads = process.env.STORAGE_DIR!;
  const database = process.env.DB_NAME!;
  let port: number;
  let db: ReturnType<typeof instance>;
  let t: TestApp;
  let archive: string;
  let manifest: Manifest;

  /** What the kitchen shows through the API: the book export, the specifications and label runs, each upload's SHA-256. */
  const snapshot = async (app: TestApp) => {
    const manager = await app.signIn('manager@example.com');
    const book = await app.req('GET', '/api/book', manager);
    expect(book.statusCode).toBe(200);
    const specifications: SpecificationView[] = [];
    for (const code of ['ground-almonds', 'icing-sugar']) {
      const res = await app.req('GET', `/api/ingredients/${code}/specifications`, manager);
      expect(res.statusCode).toBe(200);
      specifications.push(...res.json<SpecificationView[]>());
    }
    const runs = await app.req('GET', '/api/labels/runs', manager);
    expect(runs.statusCode).toBe(200);
    const uploaded: Record<string, string> = {};
    for (const s of specifications) {
      const file = await app.req('GET', s.fileUrl, manager);
      expect(file.statusCode).toBe(200);
      uploaded[s.fileUrl] = sha256(file.rawPayload);
    }
    for (const run of runs.json<LabelRun[]>()) {
      const pdf = await app.req('GET', `/api/labels/runs/${run.id}/pdf`, manager);
      expect(pdf.statusCode).toBe(200);
      uploaded[`label run ${run.id}`] = sha256(pdf.rawPayload);
    }
    return { book: book.json<unknown>(), specifications, runs: runs.json<LabelRun[]>(), uploaded };
  };
  let before: Awaited<ReturnType<typeof snapshot>>;

  /** The target instance's tables, counted as MariaDB's root sees them. */
  const tablesThere = () => {
    const r = db.sql(`SELECT COUNT(*) FROM information_schema.tables WHERE table_schema = '${database}'`);
    expect(r.status).toBe(0);
    return Number(r.stdout.trim());
  };
  const settings = () => parseBackupSettings(process.env);

  beforeAll(async () => {
    port = await freePort();
    db = await startOwnMariadb(join(dir, 'first'), port);
    t = await startTestApp({ seed: true, settings: { DB_HOST: '127.0.0.1', DB_PORT: String(port) } });
  }, 120_000);

  afterAll(async () => {
    try {
      await t?.app.close();
    } finally {
      await db?.stop();
      rmSync(dir, { recursive: true, force: true });
      rmSync(`${uploads}-before`, { recursive: true, force: true });
    }
  }, 60_000);

  it('writes one dated archive of the database and every uploaded file, with a manifest of their checksums', async () => {
    const chef = await t.signIn('chef@example.com');
    const pdf = fixture('almond-paste-spec.pdf');
    const photo = fixture('label-photo.png');
    for (const [code, bytes, name, type] of [
      ['ground-almonds', pdf, 'almonds.pdf', 'application/pdf'],
      ['icing-sugar', photo, 'sugar.png', 'image/png'],
    ] as const) {
      const form = await multipart({ note: `Supplier sheet of ${code}` }, { name, bytes, type });
      const res = await t.app.inject({
        method: 'POST',
        url: `/api/ingredients/${code}/specifications`,
        payload: form.payload,
        headers: { ...form.headers, cookie: chef },
      });
      expect(res.statusCode).toBe(201);
    }
    const printed = await t.req('POST', '/api/labels/runs', chef, {
      template: 'product',
      items: [{ product: 'vegan-brownie', quantity: 3 }],
      productionDate: '2026-12-02',
    });
    expect(printed.statusCode).toBe(201);
    const run = labelRunSchema.parse(printed.json());
    before = await snapshot(t);
    expect(Object.values(before.uploaded)).toEqual(expect.arrayContaining([sha256(pdf), sha256(photo), run.sha256]));

    const out = join(dir, 'archives');
    const backup = command('backup', ['--out', out]);
    expect({ status: backup.status, stderr: backup.stderr }).toEqual({
      status: 0,
      stderr: expect.stringContaining('Backed up the database'),
    });
    expect(backup.stderr).toMatch(/Dumping the database .* \(mariadb-dump, one consistent snapshot\)/);
    expect(backup.stderr).toMatch(/Copying 3 stored files from the folder /);
    archive = backup.stdout.trim();
    expect(archive).toMatch(new RegExp(`^${out}/crumbproof-\\d{4}-\\d\\d-\\d\\dT\\d{4}Z\\.tar\\.gz$`));
    expect(readdirSync(out)).toEqual([archive.slice(out.length + 1)]);

    const entries: string[] = [];
    await list({ file: archive, onReadEntry: (e) => entries.push(e.path) });
    const keys = [...new Set(Object.values(before.uploaded))].sort();
    expect(entries).toEqual(['manifest.json', 'database.sql', 'files/', ...keys.map((k) => `files/${k}`)]);
    const unpacked = join(dir, 'unpacked');
    mkdirSync(unpacked);
    await extract({ file: archive, cwd: unpacked });
    manifest = manifestSchema.parse(JSON.parse(readFileSync(join(unpacked, 'manifest.json'), 'utf8')));
    const rows = await t.sequelize.query<{ n: string }>(
      'SELECT table_name AS n FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY table_name',
      { type: QueryTypes.SELECT },
    );
    expect(manifest).toEqual({
      format: 'crumbproof-backup',
      formatVersion: 1,
      createdAt: expect.stringMatching(/^\d{4}-\d\d-\d\dT[\d:.]+Z$/),
      database: {
        name: database,
        migration: knownMigrations().at(-1),
        migrations: knownMigrations(),
        tables: rows.map((r) => r.n),
        dump: { path: 'database.sql', sha256: sha256(readFileSync(join(unpacked, 'database.sql'))), size: expect.any(Number) },
      },
      files: keys.map((k) => ({ path: `files/${k}`, sha256: k, size: readFileSync(join(unpacked, 'files', k)).length })),
      store: { kind: 'local' },
    });
    expect(readFileSync(join(unpacked, 'database.sql'), 'utf8')).toMatch(/CREATE TABLE `specifications`/);
  }, 90_000);

  it('refuses a damaged, cut-short or foreign archive into a fresh, empty instance, changing nothing', async () => {
    // The kitchen's instance goes; a fresh one takes its address, with an empty uploads folder.
    await t.app.close();
    await db.stop();
    renameSync(uploads, `${uploads}-before`);
    mkdirSync(uploads);
    db = await startOwnMariadb(join(dir, 'fresh'), port);
    expect(db.sql(`CREATE DATABASE \`${database}\``).status).toBe(0);
    expect(tablesThere()).toBe(0);

    const bytes = readFileSync(archive);
    const unpacked = join(dir, 'unpacked');
    const bad = (name: string, content: Buffer) => {
      const file = join(dir, name);
      writeFileSync(file, content);
      return file;
    };
    /** The archive packed again from the unpacked folder, with `change` made to a copy of it first. */
    const repacked = async (name: string, change: (folder: string) => void, entries = ['manifest.json', 'database.sql', 'files']) => {
      const folder = join(dir, `${name}-folder`);
      mkdirSync(folder);
      for (const f of filesUnder(unpacked)) {
        mkdirSync(join(folder, f, '..'), { recursive: true });
        copyFileSync(join(unpacked, f), join(folder, f));
      }
      change(folder);
      const file = join(dir, name);
      await createTar({ gzip: true, file, cwd: folder, portable: true }, entries);
      return file;
    };
    const flipByte = (file: string, at: number) => {
      const b = readFileSync(file);
      b[at] ^= 0x01;
      writeFileSync(file, b);
    };
    const aFile = manifest.files[0].path;

    const cases: [string, string, RegExp][] = [
      [
        'one byte changed in the archive',
        bad('flipped.tar.gz', Buffer.from(bytes.map((v, i) => (i === Math.floor(bytes.length / 2) ? v ^ 0x01 : v)))),
        /^flipped\.tar\.gz is damaged:\n {2}- its compressed data does not check out \(.*\): at least one byte was changed\./,
      ],
      [
        'one byte changed in the dump, packed again',
        await repacked('dump-changed.tar.gz', (f) => flipByte(join(f, 'database.sql'), 100)),
        /^dump-changed\.tar\.gz is damaged:\n {2}- database\.sql has the SHA-256 [0-9a-f]{64} \(\d+ bytes\), but the manifest says [0-9a-f]{64}/,
      ],
      [
        'one byte changed in an uploaded file, packed again',
        await repacked('file-changed.tar.gz', (f) => flipByte(join(f, aFile), 10)),
        new RegExp(`^file-changed\\.tar\\.gz is damaged:\\n {2}- ${aFile} has the SHA-256 [0-9a-f]{64}`),
      ],
      [
        'no manifest',
        await repacked('no-manifest.tar.gz', () => {}, ['database.sql', 'files']),
        /^no-manifest\.tar\.gz is not a Crumbproof backup:\n {2}- it holds no manifest\.json, which every Crumbproof backup begins with\./,
      ],
      [
        'no dump',
        await repacked('no-dump.tar.gz', () => {}, ['manifest.json', 'files']),
        /^no-dump\.tar\.gz is incomplete:\n {2}- it holds no database\.sql, which its manifest lists/,
      ],
      [
        'cut short',
        bad('half.tar.gz', bytes.subarray(0, Math.floor(bytes.length / 2))),
        /^half\.tar\.gz is cut short \(an unfinished copy or download\?\):\n {2}- its data ends before the archive does/,
      ],
      [
        'another program’s archive',
        await repacked('foreign.tar.gz', (f) => writeFileSync(join(f, 'notes.txt'), 'not a backup'), ['notes.txt']),
        /^foreign\.tar\.gz is not a Crumbproof backup:\n {2}- it holds notes\.txt, which is no part of a Crumbproof backup\./,
      ],
      [
        'not an archive at all',
        bad('readme.tar.gz', readFileSync(join(ROOT, 'README.md'))),
        /^readme\.tar\.gz is not a Crumbproof backup:\n {2}- it is not a \.tar\.gz archive \(it does not begin as gzip data does\)\./,
      ],
      [
        'a compressed file that is no archive',
        bad('readme.gz', gzipSync(readFileSync(join(ROOT, 'README.md')))),
        /^readme\.gz is not a Crumbproof backup:\n {2}- its compressed data is no tar archive\./,
      ],
      [
        'a migration this version does not have',
        await repacked('newer.tar.gz', (f) => {
          const m = JSON.parse(readFileSync(join(f, 'manifest.json'), 'utf8')) as Manifest;
          m.database.migrations.push('9999-from-a-later-version');
          m.database.migration = '9999-from-a-later-version';
          writeFileSync(join(f, 'manifest.json'), JSON.stringify(m));
        }),
        /^newer\.tar\.gz holds a database at migration 9999-from-a-later-version, and this version of Crumbproof does not have 9999-from-a-later-version/,
      ],
    ];
    for (const [what, file, message] of cases) {
      const refusal = await restore(settings(), file).then(
        () => 'restored',
        (err: Error) => err.message,
      );
      expect({ what, refusal }).toEqual({ what, refusal: expect.stringMatching(message) });
      expect(refusal).toContain(NOTHING_CHANGED);
      expect({ what, tables: tablesThere(), uploads: filesUnder(uploads) }).toEqual({ what, tables: 0, uploads: [] });
    }

    // An archive that checks out but whose dump MariaDB refuses partway: the tables it loaded go again.
    const refusedDump = await repacked('refused-dump.tar.gz', (f) => {
      const dump = Buffer.concat([readFileSync(join(f, 'database.sql')), Buffer.from('\nINSERT INTO `no_such_table` VALUES (1);\n')]);
      writeFileSync(join(f, 'database.sql'), dump);
      const m = JSON.parse(readFileSync(join(f, 'manifest.json'), 'utf8')) as Manifest;
      m.database.dump = { ...m.database.dump, sha256: sha256(dump), size: dump.length };
      writeFileSync(join(f, 'manifest.json'), JSON.stringify(m));
    });
    const stopped = await restore(settings(), refusedDump).then(
      () => 'restored',
      (err: Error) => err.message,
    );
    expect(stopped).toMatch(
      /^The dump could not be loaded: mariadb could not load the dump into the database \S+ at 127\.0\.0\.1:\d+ \(exit 1\): .*no_such_table.*\nThe restore stopped; every table it had loaded was dropped again, so the database is empty as it was\.$/s,
    );
    expect(tablesThere()).toBe(0);
    rmSync(uploads, { recursive: true });
    mkdirSync(uploads);

    // The command says it in the same words on stderr and exits 1.
    const refused = command('restore', [cases[0][1]]);
    expect(refused.status).toBe(1);
    expect(refused.stderr).toMatch(/flipped\.tar\.gz is damaged:/);
    expect(refused.stderr).toContain(NOTHING_CHANGED);
    expect(tablesThere()).toBe(0);
  }, 90_000);

  it('restores the archive into the empty instance: the same book and every upload with the same bytes', async () => {
    const restored = command('restore', [archive]);
    expect({ status: restored.status, stderr: restored.stderr }).toEqual({
      status: 0,
      stderr: expect.stringContaining('Restored the database'),
    });
    expect(restored.stderr).toMatch(/is whole: made .*, migration \S+, \d+ tables and 3 stored files\./);
    expect(restored.stderr).toMatch(/Putting 3 files into the folder /);
    expect(tablesThere()).toBe(manifest.database.tables.length);
    expect(filesUnder(uploads).sort()).toEqual(filesUnder(`${uploads}-before`).sort());

    t = await startTestApp({ existing: true, settings: { DB_HOST: '127.0.0.1', DB_PORT: String(port) } });
    const after = await snapshot(t);
    expect(after.book).toEqual(before.book);
    expect(after.specifications).toEqual(before.specifications);
    expect(after.runs).toEqual(before.runs);
    expect(after.uploaded).toEqual(before.uploaded);
    for (const s of after.specifications) expect(after.uploaded[s.fileUrl]).toBe(s.sha256);
    for (const r of after.runs) expect(after.uploaded[`label run ${r.id}`]).toBe(r.sha256);
  }, 90_000);

  it('refuses to restore over a database that holds tables, naming them, and changes nothing', async () => {
    const sums = await tableChecksums(t.sequelize);
    const count = manifest.database.tables.length;
    await expect(restore(settings(), archive)).rejects.toThrow(
      new RegExp(
        `^The database ${database} at 127\\.0\\.0\\.1:${port} already holds ${count} tables \\(account_links, .* and ${count - 8} more\\): a backup is restored only into an empty database`,
      ),
    );
    expect(await tableChecksums(t.sequelize)).toEqual(sums);
    expect(filesUnder(uploads).sort()).toEqual(filesUnder(`${uploads}-before`).sort());
  }, 60_000);

  it('restores into object storage (STORAGE=s3) and backs up from it the same files', async () => {
    const s3 = await startFakeS3();
    try {
      const inBucket = parseBackupSettings({ ...process.env, ...s3.settings, DB_NAME: `${database}_s3` });
      const restored = await restore(inBucket, archive);
      expect(restored.manifest.files).toEqual(manifest.files);
      for (const f of manifest.files) expect(sha256(await s3.object(f.sha256))).toBe(f.sha256);

      const again = await backUp(inBucket, join(dir, 'from-s3'));
      expect(again.manifest).toMatchObject({ store: { kind: 's3' }, files: manifest.files });
      expect(again.manifest.database).toMatchObject({ name: `${database}_s3`, migration: manifest.database.migration });
      // A file missing from the bucket is named, and no archive is left behind.
      await s3.client.send(new DeleteObjectCommand({ Bucket: s3.bucket, Key: `sha256/${manifest.files[0].sha256}` }));
      await expect(backUp(inBucket, join(dir, 'from-s3'))).rejects.toThrow(
        new RegExp(`^The stored file ${manifest.files[0].sha256} is not in the bucket crumbproof-uploads .* Nothing was backed up`),
      );
      expect(readdirSync(join(dir, 'from-s3'))).toEqual([basename(again.file)]);
    } finally {
      await s3.close();
    }
  }, 60_000);
});
