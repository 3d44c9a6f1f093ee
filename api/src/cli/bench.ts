import { availableParallelism } from 'node:os';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { measureApi, type ApiFigures } from '../bench/api';
import { signInBundleKb } from '../bench/bundle';
import { cliPeakRssMb } from '../bench/cli-memory';
import { measureLabels } from '../bench/labels';
import { measureRollup } from '../bench/rollup';
import { benchEnvironment } from '../config/config';
import type { KitchenSize } from '../rules/core/testing/synthetic-kitchen';
import { loadReferenceData } from '../rules/reference-data';

/**
 * npm run bench [-- --quick]: each measurement is a module of api/src/bench; the figures go to
 * bench-results.json at the repository root and one line each on stdout, with the core count
 * (timings on a shared machine are noisy: compare figures from the same run). --quick measures
 * the small book only and leaves out the CLI's memory on the large one. The API's figures and the
 * counter's are measured when api/scripts/bench.mjs has started the app (BENCH_API_URL and
 * BENCH_API_PID) and timed the counter in Chromium (BENCH_COUNTER_MS): all but --quick.
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
  const { apiUrl, apiPid, counterMs } = benchEnvironment();
  say('counter: 500 products classified in Chromium, median ms', counterMs ?? 'not measured (npm run bench without --quick)');
  const api = apiUrl ? await measureApi(apiUrl, apiPid) : null;
  if (api) sayApi(api);

  const results = {
    cores,
    rollup: { fullMs: rollup.fullMs, floorMs: rollup.floorMs, ratio: rollup.ratio, bySize: rollup.bySize },
    incrementalMs: rollup.incrementalMs,
    ...(memory ? { cliPeakRssMb: memory.peakRssMb } : {}),
    labels: { ms: labels.ms, textOnlyMs: labels.textOnlyMs, ratio: labels.ratio },
    ...(bundleKb === null ? {} : { bundleKb }),
    ...(counterMs === null ? {} : { counterMs }),
    ...(api
      ? {
          api: { p99Ms: api.p99Ms, rps: api.rps, bareRps: api.bareRps, ratio: api.ratio, errors: api.errors, bytes: api.bytes },
          allProducts: {
            p99Ms: api.allProducts.p99Ms,
            rps: api.allProducts.rps,
            bareRps: api.allProducts.bareRps,
            ratio: api.allProducts.ratio,
            errors: api.allProducts.errors,
            bytes: api.allProducts.bytes,
          },
          importMs: api.importMs,
          importStatus: api.importStatus,
          rssMb: api.rssMb,
          importRssMb: api.importRssMb,
        }
      : {}),
  };
  writeFileSync(join(root, 'bench-results.json'), `${JSON.stringify(results, null, 2)}\n`);
}

function sayApi(api: ApiFigures): void {
  for (const [what, f] of [
    ["a product's declaration", api],
    ['every product for sale (the counter)', api.allProducts],
  ] as const) {
    say(`api: ${what}, ${f.path}, ${f.bytes} bytes, 100 connections: requests/s`, f.rps);
    say(`api: ${what}: p99 ms`, f.p99Ms);
    say(`api: ${what}: errors`, f.errors);
    say(`api: ${what}: a bare Fastify route with the same bytes, requests/s`, f.bareRps);
    say(`api: ${what}: ratio`, f.ratio.toFixed(3));
  }
  say('api: peak RSS MB under load', api.rssMb ?? 'not measured');
  say(`api: the standard book imported through POST /api/book/import (status ${api.importStatus}), ms`, api.importMs);
  say('api: peak RSS MB during the import', api.importRssMb ?? 'not measured');
}

main().catch((e: unknown) => {
  process.stderr.write(`bench: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
  process.exitCode = 1;
});
