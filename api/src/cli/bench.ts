import { availableParallelism } from 'node:os';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { measureRollup } from '../bench/rollup';
import { loadReferenceData } from '../rules/reference-data';

/**
 * npm run bench: each measurement is a module of api/src/bench; the figures go to
 * bench-results.json at the repository root and one line each on stdout, with the core count
 * (timings on a shared machine are noisy: compare figures from the same run).
 */
const root = join(__dirname, '..', '..', '..');
const cores = availableParallelism();
const say = (what: string, value: number | string) =>
  process.stdout.write(`${what}: ${typeof value === 'number' ? value.toFixed(1) : value} (${cores} cores)\n`);

const refs = loadReferenceData();
const sizes = process.argv.includes('--quick') ? (['small'] as const) : (['small', 'standard', 'large'] as const);
const rollup = measureRollup(refs, [...sizes]);
for (const [size, f] of Object.entries(rollup.bySize))
  say(`rollup ${size} (${f.lines} lines, ${f.products} products) full ms / floor ms`, `${f.fullMs.toFixed(1)} / ${f.floorMs.toFixed(2)}`);
say('rollup full ms', rollup.fullMs);
say('rollup floor ms', rollup.floorMs);
say('rollup ratio', rollup.ratio);
say('incremental ms (median)', rollup.incrementalMs);

const results = {
  cores,
  rollup: { fullMs: rollup.fullMs, floorMs: rollup.floorMs, ratio: rollup.ratio, bySize: rollup.bySize },
  incrementalMs: rollup.incrementalMs,
};
writeFileSync(join(root, 'bench-results.json'), `${JSON.stringify(results, null, 2)}\n`);
