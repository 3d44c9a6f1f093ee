import { DEFAULT_SEED, KITCHEN_SHAPES, syntheticKitchen, type KitchenSize } from '../rules/core/testing/synthetic-kitchen';

/**
 * npm run synthetic-kitchen -- [small|standard|large] [--seed N]
 * Prints an invented recipe book of that size (standard unless given) on stdout, the same for the same seed.
 */
const USAGE = 'Usage: npm run synthetic-kitchen -- [small|standard|large] [--seed N]';
const args = process.argv.slice(2);
let size: KitchenSize = 'standard';
let seed = DEFAULT_SEED;
for (let i = 0; i < args.length; i++) {
  const a = args[i];
  if (a === '--seed') {
    seed = Number(args[++i]);
    if (!Number.isInteger(seed)) {
      process.stderr.write(`Give a whole number after --seed.\n${USAGE}\n`);
      process.exit(2);
    }
  } else if (a in KITCHEN_SHAPES) size = a as KitchenSize;
  else {
    process.stderr.write(`Unknown size or option '${a}'. ${USAGE}\n`);
    process.exit(2);
  }
}
process.stdout.write(`${JSON.stringify(syntheticKitchen(size, seed))}\n`);
