import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { syntheticKitchen, type KitchenSize } from '../rules/core/testing/synthetic-kitchen';

const ROOT = join(__dirname, '..', '..', '..');

/** The declaration CLI's peak resident memory (MB) declaring every product of a synthetic book, output discarded. */
export function cliPeakRssMb(size: KitchenSize = 'large'): { peakRssMb: number | null; exitCode: number | null; error?: string } {
  const dir = mkdtempSync(join(tmpdir(), 'bench-book-'));
  try {
    const file = join(dir, `${size}.book.json`);
    writeFileSync(file, JSON.stringify(syntheticKitchen(size)));
    const run = spawnSync(
      process.execPath,
      [
        '--conditions=source',
        '--import',
        'tsx',
        '--import',
        join(__dirname, 'report-peak-rss.mjs'),
        join(ROOT, 'api', 'src', 'cli', 'declare.ts'),
        file,
      ],
      { cwd: ROOT, stdio: ['ignore', 'ignore', 'pipe'], encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 },
    );
    const kb = /peak-rss-kb (\d+)/.exec(run.stderr ?? '');
    const error = run.status === 0 ? undefined : (run.stderr ?? '').split('\n').filter(Boolean).slice(-3).join(' ');
    return { peakRssMb: kb ? Number(kb[1]) / 1024 : null, exitCode: run.status, ...(error ? { error } : {}) };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
