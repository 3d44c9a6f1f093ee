import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Role } from '@crumbproof/shared';
import bcrypt from 'bcryptjs';
import { QueryTypes } from 'sequelize';
import type { TestApp } from './test-app';

/** The recipe book of two kitchens over one set of items: Test bench ("bench", the owner) and Corner Shop ("corner"). */
export const TWO_KITCHENS_BOOK = JSON.parse(
  readFileSync(join(__dirname, '../../../tests/fixtures/two-kitchens.book.json'), 'utf8'),
) as object;

/**
 * Adds an account with `password` straight to the database, created with `role`; with `at`, a
 * kitchen's code in the book, the person has that role there (and at no other kitchen). Its id.
 */
export async function addPerson(t: TestApp, email: string, role: Role, password: string, at?: string): Promise<number> {
  await t.sequelize.query(
    "INSERT INTO users (email, name, role, password_hash, active, created_at, updated_at) VALUES (?, 'Kitchen person', ?, ?, TRUE, NOW(), NOW())",
    { replacements: [email, role, bcrypt.hashSync(password, 4)] },
  );
  const [{ id }] = await t.sequelize.query<{ id: number }>('SELECT id FROM users WHERE email = ?', {
    replacements: [email],
    type: QueryTypes.SELECT,
  });
  if (at !== undefined)
    await t.sequelize.query('INSERT INTO kitchen_roles (user_id, site_id, role) SELECT ?, id, ? FROM sites WHERE code = ?', {
      replacements: [id, role, at],
    });
  return id;
}

/**
 * An empty installation given two kitchens as a kitchen's own would be: its owner, a manager
 * before any kitchen is set up, imports the two-site book and so manages both. The owner's
 * session and each kitchen's number, as sent in the kitchen header.
 */
export async function setUpTwoKitchens(t: TestApp, ownerPassword: string): Promise<{ owner: string; A: string; B: string }> {
  await addPerson(t, 'owner@example.com', 'manager', ownerPassword);
  const owner = await t.signIn('owner@example.com', ownerPassword);
  const imported = await t.req('POST', '/api/book/import', owner, TWO_KITCHENS_BOOK);
  if (imported.statusCode !== 200) throw new Error(`The two-kitchen book was not imported: ${imported.statusCode} ${imported.body}`);
  const sites = await t.sequelize.query<{ id: number; code: string }>('SELECT id, code FROM sites ORDER BY id', {
    type: QueryTypes.SELECT,
  });
  if (sites.map((s) => s.code).join() !== 'bench,corner') throw new Error(`Unexpected kitchens: ${JSON.stringify(sites)}`);
  return { owner, A: String(sites[0].id), B: String(sites[1].id) };
}
