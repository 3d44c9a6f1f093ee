import type { ApprovalsView, DeclaredChange, PendingApproval, StaleLabel } from '@crumbproof/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

// The vegan brownie as if its spread now brought egg.
const change: DeclaredChange = {
  added: [{ allergen: 'eggs', label: 'eggs', how: 'contains', sources: ['egg'] }],
  containsRemoved: [],
  mayContainRemoved: [],
  claims: [{ claim: 'egg-free', before: 'ok', after: 'fails' }],
  ingredientsText: null,
  quid: [],
  notKnownAdded: [],
  notKnownRemoved: [],
  urgent: true,
  changed: true,
};

const brownie: PendingApproval = {
  product: 'vegan-brownie',
  name: 'Dark chocolate brownie (vegan)',
  inputHash: 'c'.repeat(64),
  reason: 'changed',
  approved: { id: 4, at: '2026-12-01T07:00:00.000Z', by: 'Maren Holloway', role: 'manager', inputHash: 'b'.repeat(64), note: null },
  change,
  words: ['Now contains eggs.', 'Egg-free: holds as recorded before, now does not hold.'],
  addsAllergen: true,
  causes: [
    {
      at: '2026-12-02T09:30:00.000Z',
      by: 'Tobiah Quill',
      role: 'pastry-chef',
      action: 'ingredient.saved',
      summary: 'Revised the ingredient Plant spread (plant-spread), revision 2: Edited.',
      items: [{ kind: 'ingredient', id: 'plant-spread', name: 'Plant spread' }],
    },
  ],
};
const KITCHEN = { id: 1, code: null, name: 'Larch Street Bakehouse' };
const view = (pending: PendingApproval[], kitchens = 1): ApprovalsView => ({
  kitchen: KITCHEN,
  kitchens,
  elsewhere: [],
  regime: 'UK',
  pending,
  approvedCount: 4,
});
const stale: StaleLabel = {
  id: '7-0',
  run: 7,
  printedAt: '2026-12-01T08:00:00.000Z',
  template: 'product',
  chart: false,
  product: 'vegan-brownie',
  name: 'Dark chocolate brownie (vegan)',
  batch: '261201-VEGANB-1',
  productionDate: '2026-12-01',
  quantity: 12,
  action: "Withdraw batch 261201-VEGANB-1's labels of Dark chocolate brownie (vegan): they do not say eggs.",
  words: ['Now contains eggs.'],
  addsAllergen: true,
  approvedAt: '2026-12-02T10:00:00.000Z',
};

describe('Approvals page', () => {
  it('shows what waits with the change in words, its cause and a mark of its own for an added allergen; the manager approves what was seen', async () => {
    let pending = [brownie];
    const { calls } = mockApi(
      signedInAs('manager', {
        'GET /api/approvals': () => ({ body: view(pending) }),
        'GET /api/labels/stale': { body: [] },
        'POST /api/approvals': () => {
          pending = [];
          return {
            status: 201,
            body: {
              approved: [{ product: brownie.product, name: brownie.name, approval: { ...brownie.approved, id: 5 }, addsAllergen: true }],
            },
          };
        },
      }),
    );
    const { user } = renderApp('/approvals');
    const card = await screen.findByRole('article', { name: 'Dark chocolate brownie (vegan)' });
    expect(within(card).getByText('Now contains eggs.')).toBeInTheDocument();
    expect(within(card).getByText(/Revised the ingredient Plant spread/)).toBeInTheDocument();
    expect(within(card).getByText(/Tobiah Quill \(Pastry chef\)/)).toBeInTheDocument();
    expect(within(card).getByText('Adds an allergen')).toBeInTheDocument();
    expect(card.querySelector('[data-mark="diamond-solid"]')).not.toBeNull();

    await user.click(within(card).getByRole('button', { name: 'Approve Dark chocolate brownie (vegan)' }));
    await waitFor(() => expect(screen.getByText(/Nothing waits/)).toBeInTheDocument());
    expect(calls.filter((c) => c.method === 'POST').map((c) => c.body)).toEqual([
      { products: [{ product: 'vegan-brownie', inputHash: 'c'.repeat(64) }] },
    ]);
    expect(screen.getByRole('status')).toHaveTextContent('Approved Dark chocolate brownie (vegan).');
  });

  it('says why nothing was approved when the declaration changed since it was seen', async () => {
    mockApi(
      signedInAs('manager', {
        'GET /api/approvals': { body: view([brownie]) },
        'GET /api/labels/stale': { body: [] },
        'POST /api/approvals': {
          status: 409,
          body: {
            statusCode: 409,
            code: 'conflict',
            message:
              "Nothing was approved. Dark chocolate brownie (vegan)'s declaration has changed since you looked at it (Now may contain sesame.) Look at it again and approve.",
          },
        },
      }),
    );
    const { user } = renderApp('/approvals');
    await user.click(await screen.findByRole('button', { name: 'Approve Dark chocolate brownie (vegan)' }));
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent(/has changed since you looked at it/);
  });

  it('lets the pastry chef read what waits and what is out of date, without approving or marking handled', async () => {
    mockApi(signedInAs('pastry-chef', { 'GET /api/approvals': { body: view([brownie]) }, 'GET /api/labels/stale': { body: [stale] } }));
    renderApp('/approvals');
    expect(await screen.findByRole('article', { name: 'Dark chocolate brownie (vegan)' })).toBeInTheDocument();
    expect(screen.getByText('Only a manager approves; you can read what waits.')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /^Approve/ })).not.toBeInTheDocument();
    expect(await screen.findByRole('heading', { name: stale.action })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Mark handled' })).not.toBeInTheDocument();
  });

  it('names the kitchen whose declarations wait when several kitchens share the book, and says it approves them there only', async () => {
    mockApi(
      signedInAs('manager', {
        'GET /api/approvals': {
          body: {
            ...view([brownie], 3),
            kitchen: { id: 2, code: 'corner', name: 'Corner Shop' },
            elsewhere: [
              { kitchen: { id: 1, code: 'bench', name: 'Test bench' }, waiting: 2 },
              { kitchen: { id: 3, code: 'market', name: 'Market Stall' }, waiting: 1 },
            ],
          },
        },
        'GET /api/labels/stale': { body: [] },
      }),
    );
    renderApp('/approvals');
    const waiting = await screen.findByRole('region', { name: 'Waiting for approval' });
    expect(
      await within(waiting).findByText(
        'At Corner Shop: these are the declarations as this kitchen makes them, and an approval here approves them here only. The other 2 kitchens sharing the recipe book approve their own.',
      ),
    ).toBeInTheDocument();
    expect(
      within(waiting).getByText(
        'Also waiting at your other kitchens: 2 products at Test bench, 1 product at Market Stall. Choose the kitchen to see and approve them.',
      ),
    ).toBeInTheDocument();
  });

  it('says nothing of kitchens in an installation of one', async () => {
    mockApi(signedInAs('manager', { 'GET /api/approvals': { body: view([brownie]) }, 'GET /api/labels/stale': { body: [] } }));
    renderApp('/approvals');
    expect(await screen.findByRole('article', { name: 'Dark chocolate brownie (vegan)' })).toBeInTheDocument();
    expect(screen.queryByText(/approves them here only/)).not.toBeInTheDocument();
    expect(screen.queryByText(/Also waiting/)).not.toBeInTheDocument();
  });

  it('marks out-of-date labels handled with what was done (manager)', async () => {
    let list = [stale];
    const { calls } = mockApi(
      signedInAs('manager', {
        'GET /api/approvals': { body: view([]) },
        'GET /api/labels/stale': () => ({ body: list }),
        'POST /api/labels/stale/7-0/handled': () => {
          list = [];
          return { body: { id: '7-0', handled: true } };
        },
      }),
    );
    const { user } = renderApp('/approvals');
    await user.type(await screen.findByRole('textbox', { name: /What was done/ }), 'Withdrawn from the shelf');
    await user.click(screen.getByRole('button', { name: 'Mark handled' }));
    expect(await screen.findByText(/No printed label or chart is out of date/)).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'POST').map((c) => c.body)).toEqual([{ note: 'Withdrawn from the shelf' }]);
  });
});
