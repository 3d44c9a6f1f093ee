import { resolve } from 'node:path';
import { backUp } from '../backup/back-up';
import { terminalReporter } from '../backup/progress';
import { backupSettings, runCommand } from './backup-cli';

/**
 * npm run backup -- [--out DIR]
 * Writes one dated archive (crumbproof-2026-12-03T1412Z.tar.gz) of the database and the stored
 * files into DIR (from where npm was run), or BACKUP_DIR, or backups/ at the root: see
 * backup/back-up.ts. Progress goes to stderr, the archive's path to stdout.
 */
const USAGE = 'Usage: npm run backup -- [--out DIR]   (DIR: where the archive goes; BACKUP_DIR, or backups/, when not given)';

let out: string | undefined;

runCommand(
  USAGE,
  (argv) => {
    for (let i = 0; i < argv.length; i++) {
      if (argv[i] === '--out') {
        if (out !== undefined) return 'Give --out once.';
        out = argv[++i];
        if (out === undefined || out.startsWith('--')) return 'Give the folder after --out.';
      } else return argv[i].startsWith('--') ? `Unknown option ${argv[i]}.` : `Unexpected ${argv[i]}: a backup takes no file.`;
    }
    return null;
  },
  async () => {
    const settings = backupSettings();
    const { file } = await backUp(settings, out ? resolve(out) : settings.BACKUP_DIR, terminalReporter());
    process.stdout.write(`${file}\n`);
  },
);
