import { createHash } from 'node:crypto';
import { createReadStream, createWriteStream, type WriteStream } from 'node:fs';
import { mkdir, open, rename, stat, writeFile } from 'node:fs/promises';
import { basename, join } from 'node:path';
import { pipeline } from 'node:stream/promises';
import { create as createTar, Parser, type ReadEntry } from 'tar';
import { z } from 'zod';
import { BackupError } from './backup-error';
import type { Reporter } from './progress';

/**
 * A Crumbproof backup is one gzip-compressed tar archive of three kinds of entry, the manifest first:
 *
 *   manifest.json    what the archive holds (manifestSchema): its format, when it was made, the
 *                    database's migration level and tables, and the SHA-256 and size of every entry
 *   database.sql     the database's dump (mariadb-dump)
 *   files/<sha256>   each stored file the database names (supplier specifications, label runs'
 *                    PDFs), named by its content address as the file store keeps it
 *
 * Nothing else belongs in it: an archive with another entry, without one the manifest lists, or
 * with bytes whose checksum is not the manifest's, is refused whole.
 */
export const ARCHIVE_FORMAT = 'crumbproof-backup';
export const FORMAT_VERSION = 1;
export const MANIFEST = 'manifest.json';
export const DUMP = 'database.sql';
export const FILES_DIR = 'files';
const FILE_ENTRY = /^files\/([0-9a-f]{64})$/;
/** A manifest larger than this is no Crumbproof manifest (one of a million files is about 150 MB; 256 MB leaves room). */
const MANIFEST_MAX_BYTES = 256 * 1024 * 1024;

const sha256 = z.string().regex(/^[0-9a-f]{64}$/, 'a SHA-256 in lower-case hex');
const size = z.number().int().nonnegative();

export const manifestSchema = z.object({
  format: z.literal(ARCHIVE_FORMAT),
  formatVersion: z.literal(FORMAT_VERSION),
  createdAt: z.iso.datetime(),
  database: z.object({
    /** The database it was dumped from (a restore may load it into another). */
    name: z.string().min(1),
    /** The migration level: the last migration applied. */
    migration: z.string().min(1),
    /** Every migration applied, in order. */
    migrations: z.array(z.string().min(1)).min(1),
    tables: z.array(z.string().min(1)),
    dump: z.object({ path: z.literal(DUMP), sha256, size }),
  }),
  files: z.array(
    z
      .object({ path: z.string().regex(FILE_ENTRY, 'files/ and the file’s SHA-256'), sha256, size })
      .refine((f) => f.path === `${FILES_DIR}/${f.sha256}`, 'A stored file is named by its SHA-256.'),
  ),
  /** The store the files were read from: `local` or `s3`. */
  store: z.object({ kind: z.enum(['local', 's3']) }),
});
export type Manifest = z.infer<typeof manifestSchema>;

/** The path of a stored file in the archive. */
export const fileEntry = (key: string) => `${FILES_DIR}/${key}`;

/**
 * Packs the staging folder (its database.sql and files/, beside the manifest written here) into
 * `target`: written under a temporary name and renamed at the end, so an archive of that name is
 * always whole. Answers its size.
 */
export async function writeArchive(staging: string, manifest: Manifest, target: string, reporter: Reporter): Promise<number> {
  const listing = Buffer.from(`${JSON.stringify(manifest, null, 2)}\n`);
  await writeFile(join(staging, MANIFEST), listing);
  await mkdir(join(staging, FILES_DIR), { recursive: true });
  const total = listing.length + manifest.database.dump.size + manifest.files.reduce((sum, f) => sum + f.size, 0);
  const meter = reporter.meter('Packed', total, 'bytes');
  const partial = `${target}.partial`;
  const packed = createTar(
    {
      gzip: true,
      cwd: staging,
      portable: true,
      onWriteEntry: (entry) => {
        entry.on('end', () => meter.add(entry.type === 'File' ? (entry.stat?.size ?? 0) : 0));
      },
    },
    [MANIFEST, DUMP, FILES_DIR],
  );
  await pipeline(packed, createWriteStream(partial, { flags: 'wx', mode: 0o600 }));
  meter.done();
  await rename(partial, target);
  return (await stat(target)).size;
}

type Kind = 'foreign' | 'damaged' | 'truncated' | 'incomplete' | 'newer';

/** What a kind of problem makes of the archive, in the first sentence of a refusal. */
const VERDICT: Record<Kind, string> = {
  foreign: 'is not a Crumbproof backup',
  damaged: 'is damaged',
  truncated: 'is cut short (an unfinished copy or download?)',
  incomplete: 'is incomplete',
  newer: 'was made by a newer version of Crumbproof',
};

/** What to do, by the worst problem. */
const ADVICE: Record<Kind, string> = {
  foreign: 'Give an archive written by npm run backup (crumbproof-….tar.gz).',
  damaged: 'Use another copy of this backup.',
  truncated: 'Copy the backup again, whole, or use another copy.',
  incomplete: 'Use another copy of this backup.',
  newer: 'Restore it with the version of Crumbproof that made it, or a later one.',
};

/** The archive could not be read whole: why, in words, every problem found. */
export class ArchiveRefused extends BackupError {
  constructor(
    readonly file: string,
    readonly problems: { kind: Kind; text: string }[],
  ) {
    super(
      `${basename(file)} ${VERDICT[problems[0].kind]}:\n${problems.map((p) => `  - ${p.text}`).join('\n')}\n${ADVICE[problems[0].kind]}`,
    );
    this.name = 'ArchiveRefused';
  }
}

/** What the gzip or tar layer's error says about the archive; `first`: before any entry was read. */
function readError(err: Error & { code?: string }, first: boolean): { kind: Kind; text: string } {
  const message = err.message.replace(/^TAR_BAD_ARCHIVE: /, '');
  if (first && (err.code === 'TAR_ENTRY_INVALID' || /Unrecognized archive format/i.test(message)))
    return { kind: 'foreign', text: 'its compressed data is no tar archive.' };
  if (err.code === 'Z_BUF_ERROR' || /unexpected end of file|Truncated input/i.test(message))
    return { kind: 'truncated', text: `its data ends before the archive does (${message}).` };
  if (err.code === 'Z_DATA_ERROR' || err.code === 'TAR_ENTRY_INVALID' || /incorrect (data|header) check|checksum/i.test(message))
    return { kind: 'damaged', text: `its compressed data does not check out (${message}): at least one byte was changed.` };
  return { kind: 'damaged', text: `it cannot be read (${message}).` };
}

interface Seen {
  sha256: string;
  size: number;
}

/**
 * Reads the whole archive and checks it against its manifest: the manifest present, valid and of
 * this format, the dump present, every entry's SHA-256 and size as listed, nothing missing and
 * nothing else. With `extractTo`, each entry's bytes are written there as they are checked
 * (`database.sql`, `files/<sha256>`), for a restore to use once the whole archive has passed.
 * Refuses with every problem found (ArchiveRefused); answers the manifest.
 */
export async function readArchive(file: string, reporter: Reporter, extractTo?: string): Promise<Manifest> {
  let total: number;
  try {
    const s = await stat(file);
    if (!s.isFile()) throw new BackupError(`${file} is not a file. Give the path of a backup archive (crumbproof-….tar.gz).`);
    total = s.size;
  } catch (err) {
    if (err instanceof BackupError) throw err;
    throw new BackupError(`There is no file ${file}. Give the path of a backup archive (crumbproof-….tar.gz).`, { cause: err });
  }
  const head = Buffer.alloc(2);
  const handle = await open(file, 'r');
  try {
    await handle.read(head, 0, 2, 0);
  } finally {
    await handle.close();
  }
  if (head[0] !== 0x1f || head[1] !== 0x8b)
    throw new ArchiveRefused(file, [{ kind: 'foreign', text: 'it is not a .tar.gz archive (it does not begin as gzip data does).' }]);
  if (extractTo) await mkdir(join(extractTo, FILES_DIR), { recursive: true });

  const problems: { kind: Kind; text: string }[] = [];
  const seen = new Map<string, Seen>();
  const writes: Promise<Error | null>[] = [];
  const outs: WriteStream[] = [];
  let stopped = false;
  let manifestBytes: Buffer | null = null;

  const onEntry = (entry: ReadEntry) => {
    const path = entry.path;
    if (entry.type === 'Directory' && (path === `${FILES_DIR}/` || path === FILES_DIR)) return void entry.resume();
    const known = entry.type === 'File' && (path === MANIFEST || path === DUMP || FILE_ENTRY.test(path));
    if (!known) {
      problems.push({
        kind: 'foreign',
        text: `it holds ${path}${entry.type === 'File' ? '' : ` (${entry.type})`}, which is no part of a Crumbproof backup.`,
      });
      return void entry.resume();
    }
    if (seen.has(path)) {
      problems.push({ kind: 'damaged', text: `it holds ${path} twice.` });
      return void entry.resume();
    }
    const hash = createHash('sha256');
    const record: Seen = { sha256: '', size: 0 };
    seen.set(path, record);
    const chunks: Buffer[] = [];
    const out = extractTo && path !== MANIFEST ? createWriteStream(join(extractTo, path), { mode: 0o600 }) : null;
    entry.on('data', (chunk: Buffer) => {
      hash.update(chunk);
      record.size += chunk.length;
      if (path === MANIFEST && record.size <= MANIFEST_MAX_BYTES) chunks.push(chunk);
      if (out && !out.destroyed) out.write(chunk);
    });
    entry.on('end', () => {
      record.sha256 = hash.digest('hex');
      if (path === MANIFEST) manifestBytes = record.size <= MANIFEST_MAX_BYTES ? Buffer.concat(chunks) : null;
      out?.end();
    });
    if (out) {
      outs.push(out);
      writes.push(
        new Promise((resolve) => {
          let failed: Error | null = null;
          out.once('error', (err) => (failed = err)).once('close', () => resolve(failed));
        }),
      );
    }
  };

  const meter = reporter.meter('Checked', total, 'bytes');
  const parser = new Parser({ strict: true, onReadEntry: onEntry });
  const source = createReadStream(file);
  source.on('data', (chunk) => meter.add(chunk.length));
  await new Promise<void>((resolve) => {
    let settled = false;
    const finish = (err?: Error) => {
      if (settled) return;
      settled = true;
      if (err) {
        stopped = true;
        problems.push(readError(err, seen.size === 0 && problems.length === 0));
      }
      resolve();
    };
    parser.on('error', finish);
    parser.on('end', () => finish());
    source.on('error', finish);
    source.pipe(parser);
  });
  source.destroy();
  meter.done();
  // An entry cut off by a read error never ends: its file is let go, to be removed with the folder.
  for (const out of outs) if (!out.writableEnded) out.destroy();
  const writeFailed = (await Promise.all(writes)).find((err) => err !== null);
  // Past a read error nothing after it can be checked: the error, and what was seen before it, say why.
  if (stopped) throw new ArchiveRefused(file, sorted(problems));
  if (writeFailed)
    throw new BackupError(`Could not unpack ${basename(file)} into ${extractTo}: ${writeFailed.message}`, { cause: writeFailed });

  const manifest = checkManifest(manifestBytes, seen.has(MANIFEST), problems);
  if (manifest) {
    const expected = new Map<string, Seen>([[DUMP, manifest.database.dump], ...manifest.files.map((f) => [f.path, f] as const)]);
    for (const [path, listed] of expected) {
      const got = seen.get(path);
      if (!got) problems.push({ kind: 'incomplete', text: `it holds no ${path}, which its manifest lists (${listed.size} bytes).` });
      else if (got.sha256 !== listed.sha256 || got.size !== listed.size) {
        problems.push({
          kind: 'damaged',
          text: `${path} has the SHA-256 ${got.sha256} (${got.size} bytes), but the manifest says ${listed.sha256} (${listed.size} bytes).`,
        });
      }
    }
    for (const path of seen.keys())
      if (path !== MANIFEST && !expected.has(path))
        problems.push({ kind: 'foreign', text: `it holds ${path}, which its manifest does not list.` });
  }
  if (problems.length > 0) throw new ArchiveRefused(file, sorted(problems));
  return manifest!;
}

/** The worst first, for the refusal's first sentence: a file from elsewhere, a newer format, damage, a short copy, a missing entry. */
function sorted(problems: { kind: Kind; text: string }[]) {
  const order: Kind[] = ['foreign', 'newer', 'damaged', 'truncated', 'incomplete'];
  return [...problems].sort((a, b) => order.indexOf(a.kind) - order.indexOf(b.kind));
}

/** The manifest, or null with the reason among the problems. */
function checkManifest(bytes: Buffer | null, present: boolean, problems: { kind: Kind; text: string }[]): Manifest | null {
  if (!present) {
    problems.push({ kind: 'foreign', text: `it holds no ${MANIFEST}, which every Crumbproof backup begins with.` });
    return null;
  }
  if (!bytes) {
    problems.push({ kind: 'foreign', text: `its ${MANIFEST} is larger than any Crumbproof manifest.` });
    return null;
  }
  let json: unknown;
  try {
    json = JSON.parse(bytes.toString('utf8'));
  } catch (err) {
    problems.push({ kind: 'damaged', text: `its ${MANIFEST} is not JSON (${(err as Error).message}).` });
    return null;
  }
  const head = z.object({ format: z.unknown(), formatVersion: z.unknown() }).safeParse(json);
  if (!head.success || head.data.format !== ARCHIVE_FORMAT) {
    problems.push({ kind: 'foreign', text: `its ${MANIFEST} is not a Crumbproof backup's (its format is not "${ARCHIVE_FORMAT}").` });
    return null;
  }
  if (typeof head.data.formatVersion === 'number' && head.data.formatVersion > FORMAT_VERSION) {
    problems.push({
      kind: 'newer',
      text: `its format is version ${head.data.formatVersion}, and this Crumbproof reads version ${FORMAT_VERSION}.`,
    });
    return null;
  }
  const parsed = manifestSchema.safeParse(json);
  if (!parsed.success) {
    const first = parsed.error.issues.slice(0, 5).map((i) => `${i.path.join('.') || '(top)'}: ${i.message}`);
    problems.push({ kind: 'damaged', text: `its ${MANIFEST} is not valid (${first.join('; ')}).` });
    return null;
  }
  return parsed.data;
}
