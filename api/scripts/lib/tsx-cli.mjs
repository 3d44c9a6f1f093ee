// Runs a command-line program of api/src/cli through tsx from the repository root, passing the
// arguments on and exiting with the program's own exit code.
import { spawnSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..', '..');

/**
 * Runs api/src/cli/NAME.ts with the arguments npm was given.
 * @param {string} name
 */
export function runCli(name) {
  process.exit(runCliStatus(name));
}

/**
 * Runs api/src/cli/NAME.ts with the arguments npm was given and these settings added to the
 * environment, answering its exit code.
 * @param {string} name
 * @param {Record<string, string>} [env]
 * @returns {number}
 */
export function runCliStatus(name, env = {}) {
  const tsx = join(root, 'node_modules', '.bin', process.platform === 'win32' ? 'tsx.cmd' : 'tsx');
  // --conditions=source resolves @crumbproof/shared to its TypeScript source (no build needed).
  // Paths on the command line are read from where the user ran npm (INIT_CWD), not the root.
  const run = spawnSync(tsx, ['--conditions=source', join(root, 'api', 'src', 'cli', `${name}.ts`), ...process.argv.slice(2)], {
    cwd: process.env.INIT_CWD ?? process.cwd(),
    stdio: 'inherit',
    env: { ...process.env, ...env },
  });
  if (run.error) {
    process.stderr.write(`Cannot run ${tsx}: ${run.error.message}\n`);
    return 1;
  }
  return run.status ?? 1;
}
