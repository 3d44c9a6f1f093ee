import { availableParallelism } from 'node:os';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { signInBundleKb } from '../bench/bundle';
import { cliPeakRssMb } from '../bench/cli-memory';
import { measureLabels } from '../bench/labels';
import { measureRollup } from '../bench/rollup';
import type { KitchenSize } from '../rules/core/testing/synthetic-kitchen';
import { loadReferenceData } from '../rules/reference-data';

/**
 * npm run bench [-- --quick]: each measurement is a module of api/src/bench; the figures go to
 * bench-results.json at the repository root and one line each on stdout, with the core count
 * (timings on a shared machine are noisy: compare figures from the same run). --quick measures
 * the small book only and leaves out the CLI's memory on the large one.
 */
const root = join(__dirname, '..', '..', '..');
const cores = availableParallelism();
const quick = process.argv.includes('--quick');
const say = (what: string, value: number | string) =>
  process.stdout.write(`${what}: ${typeof value === 'number' ? value.toFixed(1) : value} (${cores} cores)\n`);

const refs = loadReferenceData();
const sizes: KitchenSize[] = quick ? ['small'] : ['small', 'standard', 'large'];
const rollup = measureRollup(refs, sizes);
for (const [size, f] of Object.entries(rollup.bySize))
  say(`rollup ${size} (${f.lines} lines, ${f.products} products) full ms / floor ms`, `${f.fullMs.toFixed(1)} / ${f.floorMs.toFixed(2)}`);
say('rollup full ms', rollup.fullMs);
say('rollup floor ms', rollup.floorMs);
say('rollup ratio', rollup.ratio);
say(`incremental ms (median of ${rollup.incrementalProducts} changes)`, rollup.incrementalMs);
const memory = quick ? null : cliPeakRssMb('large');
if (memory) say('declare CLI peak RSS MB (large book)', memory.peakRssMb ?? `not measured (exit ${memory.exitCode}: ${memory.error})`);

async function main(): Promise<void> {
  const labels = await measureLabels(refs);
  say(`labels: ${labels.labels} case labels with GS1-128 into one PDF, ms`, labels.ms);
  say('labels: a text-only document of as many pages, ms', labels.textOnlyMs);
  say('labels ratio', labels.ratio);
  const bundleKb = signInBundleKb();
  say('sign-in page gzipped JavaScript KB', bundleKb ?? 'not measured (build the web app first: npm run build)');

  const results = {
    cores,
    rollup: { fullMs: rollup.fullMs, floorMs: rollup.floorMs, ratio: rollup.ratio, bySize: rollup.bySize },
    incrementalMs: rollup.incrementalMs,
    ...(memory ? { cliPeakRssMb: memory.peakRssMb } : {}),
    labels: { ms: labels.ms, textOnlyMs: labels.textOnlyMs, ratio: labels.ratio },
    ...(bundleKb === null ? {} : { bundleKb }),
  };
  writeFileSync(join(root, 'bench-results.json'), `${JSON.stringify(results, null, 2)}\n`);
}

main().catch((e: unknown) => {
  process.stderr.write(`bench: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
  process.exitCode = 1;
});
