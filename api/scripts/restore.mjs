// npm run restore: runs api/src/cli/restore.ts on the kitchen's database (lib/kitchen-database.mjs).
import { runOnKitchenDatabase } from './lib/kitchen-database.mjs';

runOnKitchenDatabase('restore');
