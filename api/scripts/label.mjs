// Runs the label CLI (api/src/cli/label.ts); see lib/tsx-cli.mjs.
import { runCli } from './lib/tsx-cli.mjs';

runCli('label');
