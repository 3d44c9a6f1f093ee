// Runs the benchmarks (api/src/cli/bench.ts); see lib/tsx-cli.mjs.
import { runCli } from './lib/tsx-cli.mjs';

runCli('bench');
