import { ChangeFeed } from '../../src/database/change-feed';
import type { TestApp } from './test-app';

/**
 * After a test changes sessions, accounts or kitchen roles straight in the database (as an operator
 * would by hand): raises the access revision, as every write through the API does in its own
 * transaction, and has the app ask for it now instead of at its next poll (ChangeFeed).
 */
export async function changedByHand(t: Pick<TestApp, 'app' | 'sequelize'>): Promise<void> {
  await t.sequelize.query("UPDATE change_revisions SET revision = revision + 1 WHERE name = 'access'");
  await t.app.get(ChangeFeed).hear();
}
