import { isAbsolute, resolve } from 'node:path';
import { BackupError } from '../backup/backup-error';
import { environmentBackupSettings, type BackupSettings } from '../config/config';

/** The repository's root, which STORAGE_DIR and BACKUP_DIR are relative to (npm start runs the API there). */
export const ROOT = resolve(__dirname, '..', '..', '..');

/** The settings of `npm run backup` and `npm run restore`, their folders made absolute from the root. */
export function backupSettings(): BackupSettings {
  let settings: BackupSettings;
  try {
    settings = environmentBackupSettings();
  } catch (err) {
    throw new BackupError((err as Error).message);
  }
  const fromRoot = (dir: string) => (isAbsolute(dir) ? dir : resolve(ROOT, dir));
  return { ...settings, STORAGE_DIR: fromRoot(settings.STORAGE_DIR), BACKUP_DIR: fromRoot(settings.BACKUP_DIR) };
}

/**
 * Runs a backup command: wrong arguments or settings exit 2 with the usage, a refusal exits 1
 * with its reason on stderr, success exits 0.
 */
export function runCommand(usage: string, parse: (argv: string[]) => string | null, main: () => Promise<void>) {
  const wrong = parse(process.argv.slice(2));
  if (wrong !== null) {
    process.stderr.write(`${wrong}\n${usage}\n`);
    process.exit(2);
  }
  main().then(
    () => process.exit(0),
    (err: unknown) => {
      // A refusal says what to do; anything else is a fault of the program, shown with where it happened.
      const text = err instanceof BackupError ? err.message : err instanceof Error ? (err.stack ?? err.message) : String(err);
      process.stderr.write(`\n${text}\n`);
      process.exit(1);
    },
  );
}
