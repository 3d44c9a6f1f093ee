import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import bcrypt from 'bcryptjs';
import { KITCHEN_HEADER, type KitchenRole } from '@crumbproof/shared';
import { startTestApp, type TestApp } from './test-app';

const PASSWORD = 'chain-kitchens-pass-27';
const CHAIN = JSON.parse(
  readFileSync(join(__dirname, '..', '..', '..', 'tests', 'fixtures', 'chain-kitchens.book.json'), 'utf8'),
) as object;

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH';

/** A test app holding the three kitchens of tests/fixtures/chain-kitchens.book.json. */
export interface ChainApp {
  t: TestApp;
  /** Mira Manager's session: she imported the book, so she manages every kitchen. */
  manager: string;
  /** Cas Chef's session: a pastry chef at the first kitchen (the bench) only. */
  chef: string;
  /** The kitchens' numbers by their id in the book: bench, corner, market. */
  kitchen: Record<string, number>;
  /** A JSON request for the kitchen named by its id in the book (the kitchen header). */
  at(where: string, method: Method, url: string, cookie: string, payload?: object): ReturnType<TestApp['app']['inject']>;
}

/**
 * A fresh app with a manager and a pastry chef, where the manager imports the chain's book: the
 * first kitchen is everyone's, and the two new ones are the importing manager's.
 */
export async function startChainApp(): Promise<ChainApp> {
  const t = await startTestApp();
  const hash = bcrypt.hashSync(PASSWORD, 4);
  for (const [email, name, role] of [
    ['manager@chain.example', 'Mira Manager', 'manager'],
    ['chef@chain.example', 'Cas Chef', 'pastry-chef'],
  ])
    await t.sequelize.query(
      'INSERT INTO users (email, name, role, password_hash, active, created_at, updated_at) VALUES (?, ?, ?, ?, TRUE, NOW(), NOW())',
      { replacements: [email, name, role, hash] },
    );
  const manager = await t.signIn('manager@chain.example', PASSWORD);
  const chef = await t.signIn('chef@chain.example', PASSWORD);
  const imported = await t.req('POST', '/api/book/import', manager, CHAIN);
  if (imported.statusCode !== 200) throw new Error(`The chain's book was not imported: ${imported.statusCode} ${imported.body}`);
  const kitchen: Record<string, number> = {};
  for (const k of (await t.req('GET', '/api/me', manager)).json<{ kitchens: KitchenRole[] }>().kitchens) kitchen[k.code!] = k.id;
  return {
    t,
    manager,
    chef,
    kitchen,
    at: (where, method, url, cookie, payload) =>
      t.app.inject({ method, url, headers: { cookie, [KITCHEN_HEADER]: String(kitchen[where]) }, ...(payload ? { payload } : {}) }),
  };
}
