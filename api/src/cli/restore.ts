import { resolve } from 'node:path';
import { restore } from '../backup/restore';
import { terminalReporter } from '../backup/progress';
import { backupSettings, runCommand } from './backup-cli';

/**
 * npm run restore -- FILE
 * Restores an archive of npm run backup into an empty database and the file store, after
 * checking it whole: see backup/restore.ts. A refusal exits 1 with its reason, changing nothing.
 */
const USAGE = 'Usage: npm run restore -- FILE   (an archive written by npm run backup, crumbproof-….tar.gz)';

let file: string | undefined;

runCommand(
  USAGE,
  (argv) => {
    for (const a of argv) {
      if (a.startsWith('--')) return `Unknown option ${a}.`;
      if (file !== undefined) return `Give one archive only (got ${file} and ${a}).`;
      file = a;
    }
    return file === undefined ? 'Give the archive to restore.' : null;
  },
  async () => {
    await restore(backupSettings(), resolve(file!), terminalReporter());
  },
);
