// Runs the declaration CLI (api/src/cli/declare.ts); see lib/tsx-cli.mjs.
import { runCli } from './lib/tsx-cli.mjs';

runCli('declare');
