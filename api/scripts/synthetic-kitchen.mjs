// Prints a synthetic recipe book (api/src/cli/synthetic-kitchen.ts); see lib/tsx-cli.mjs.
import { runCli } from './lib/tsx-cli.mjs';

runCli('synthetic-kitchen');
