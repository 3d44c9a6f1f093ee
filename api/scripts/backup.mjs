// npm run backup: runs api/src/cli/backup.ts on the kitchen's database (lib/kitchen-database.mjs).
import { runOnKitchenDatabase } from './lib/kitchen-database.mjs';

runOnKitchenDatabase('backup');
