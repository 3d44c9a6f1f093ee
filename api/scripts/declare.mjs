// Runs the declaration CLI (api/src/cli/declare.ts) through tsx from the repository root,
// passing the arguments on and exiting with the CLI's own exit code.
import { spawnSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const tsx = join(root, 'node_modules', '.bin', process.platform === 'win32' ? 'tsx.cmd' : 'tsx');
// --conditions=source resolves @crumbproof/shared to its TypeScript source (no build needed).
const run = spawnSync(tsx, ['--conditions=source', join('api', 'src', 'cli', 'declare.ts'), ...process.argv.slice(2)], {
  cwd: root,
  stdio: 'inherit',
});
if (run.error) {
  process.stderr.write(`Cannot run ${tsx}: ${run.error.message}\n`);
  process.exit(1);
}
process.exit(run.status ?? 1);
