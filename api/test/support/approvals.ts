import type { ApprovalsGiven, ApprovalsView } from '@crumbproof/shared';
import type { TestApp } from './test-app';

/**
 * Approves, as the manager whose session cookie is given, every product waiting for approval at
 * the declaration GET /api/approvals lists: labels print only from an approved declaration.
 * Returns the products approved; fails loudly when the API refuses.
 */
export async function approveAll(t: TestApp, managerCookie: string): Promise<string[]> {
  const list = await t.app.inject({ method: 'GET', url: '/api/approvals', headers: { cookie: managerCookie } });
  if (list.statusCode !== 200) throw new Error(`GET /api/approvals answered ${list.statusCode} ${list.body}`);
  const { pending } = list.json<ApprovalsView>();
  if (pending.length === 0) return [];
  const res = await t.app.inject({
    method: 'POST',
    url: '/api/approvals',
    headers: { cookie: managerCookie },
    payload: { products: pending.map((p) => ({ product: p.product, inputHash: p.inputHash })) },
  });
  if (res.statusCode !== 201) throw new Error(`POST /api/approvals answered ${res.statusCode} ${res.body}`);
  return res.json<ApprovalsGiven>().approved.map((a) => a.product);
}
