import type { LabelRun, LabelRunRequest, RecipeView } from '@crumbproof/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs, type ApiHandlers } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

const TART: RecipeView = {
  id: 'lemon-tart',
  name: 'Lemon tart',
  lines: [{ use: 'flour', qty: 200, unit: 'g' }],
  sale: { portionG: 120, dateMark: 'use-by', shelfLifeDays: 3, gtin: '6291041500213', caseGtin: '16291041500210', unitsPerCase: 6 },
  revision: 7,
  updatedAt: '2026-12-01T08:00:00.000Z',
};
const LOAF: RecipeView = {
  id: 'spelt-loaf',
  name: 'Spelt loaf',
  lines: [{ use: 'flour', qty: 500, unit: 'g' }],
  sale: { portionG: 50 },
  revision: 2,
  updatedAt: '2026-11-20T08:00:00.000Z',
};
const SPONGE_BASE: RecipeView = {
  id: 'sponge-base',
  name: 'Sponge base',
  lines: [{ use: 'flour', qty: 100, unit: 'g' }],
  revision: 1,
  updatedAt: '2026-11-01T08:00:00.000Z',
};

/** The templates as the API lists them, reduced to what the form reads. */
const TEMPLATES = [
  { id: 'product', title: 'Product label', purpose: 'unit', printsBatch: true },
  { id: 'case', title: 'Case label', purpose: 'case', printsBatch: true },
];

function run(overrides: Partial<LabelRun> = {}): LabelRun {
  return {
    id: 41,
    printedAt: '2026-12-02T06:10:00.000Z',
    printedBy: { id: 1, name: 'Maren Okafor' },
    template: 'case',
    productionDate: '2026-12-02',
    items: [
      {
        product: 'lemon-tart',
        name: 'Lemon tart',
        revision: 7,
        basisComputedAt: '2026-12-02T06:00:00.000Z',
        quantity: 4,
        batch: '261202-LEMONT-1',
        dateMark: 'use-by',
        date: '2026-12-05',
      },
    ],
    override: null,
    pdfBytes: 20480,
    sha256: 'ab'.repeat(32),
    current: true,
    ...overrides,
  };
}

function labelsApi(role: 'manager' | 'pastry-chef', extra: ApiHandlers = {}) {
  return mockApi(
    signedInAs(role, {
      'GET /api/recipes': { body: [TART, LOAF, SPONGE_BASE] },
      'GET /api/labels/templates': { body: TEMPLATES },
      'GET /api/labels/runs': { body: [] },
      ...extra,
    }),
  );
}

describe('Labels page', () => {
  it('opens with the template named in the address picked (the counter links to the allergen chart so)', async () => {
    labelsApi('pastry-chef', {
      'GET /api/labels/templates': { body: [...TEMPLATES, { id: 'chart', title: 'Allergen chart', purpose: 'chart', printsBatch: false }] },
    });
    renderApp('/labels?template=chart');
    expect(await screen.findByLabelText('Template')).toHaveValue('chart');
  });

  it('opens with the first template when the address names none it has', async () => {
    labelsApi('pastry-chef');
    renderApp('/labels?template=menu');
    expect(await screen.findByLabelText('Template')).toHaveValue('product');
  });

  it('prints a case run of the products given a quantity, and the print log is read again and shows it', async () => {
    let logged: LabelRun[] = [];
    const { calls } = labelsApi('manager', {
      'GET /api/labels/runs': () => ({ body: logged }),
      'POST /api/labels/runs': ({ body }) => {
        const request = body as LabelRunRequest;
        logged = [run({ id: 42, items: [{ ...run().items[0]!, quantity: request.items[0]!.quantity }] })];
        return { status: 201, body: logged[0] };
      },
    });
    const { user } = renderApp('/labels');
    await user.selectOptions(await screen.findByLabelText('Template'), 'case');
    // Only products for sale are offered; a sub-recipe is not.
    expect(screen.getByLabelText('Cases of Lemon tart')).toBeInTheDocument();
    expect(screen.queryByLabelText('Cases of Sponge base')).not.toBeInTheDocument();
    expect(screen.getByText(/case GTIN 16291041500210 · 6 per case/)).toBeInTheDocument();

    await user.type(screen.getByLabelText('Cases of Lemon tart'), '4');
    await user.type(screen.getByLabelText('Units per case'), '8');
    await user.click(screen.getByLabelText(/Shipment units \(SSCC\)/));
    const date = screen.getByLabelText('Production date');
    await user.clear(date);
    await user.type(date, '2026-12-02');
    await user.click(screen.getByRole('button', { name: 'Print' }));

    await waitFor(() => expect(calls.some((c) => c.method === 'POST')).toBe(true));
    expect(calls.find((c) => c.method === 'POST')?.body).toEqual({
      template: 'case',
      productionDate: '2026-12-02',
      items: [{ product: 'lemon-tart', quantity: 4 }],
      unitsPerCase: 8,
      shipment: true,
    });
    expect(await screen.findByRole('link', { name: 'Download the PDF of run 42' })).toHaveAttribute(
      'href',
      '/api/labels/runs/42/pdf?kitchen=1',
    );
    // The log was read again after the print, and shows the run with its PDF.
    const log = screen.getByRole('region', { name: 'Print log, newest first' });
    expect(await within(log).findByRole('link', { name: 'PDF of run 42' })).toHaveAttribute('href', '/api/labels/runs/42/pdf?kitchen=1');
    expect(within(log).getByText(/batch 261202-LEMONT-1 · use by 5 Dec 2026/)).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'GET' && c.path === '/api/labels/runs').length).toBeGreaterThanOrEqual(2);
  });

  it('shows a refused print in words under the product it is about, and says nothing was printed', async () => {
    labelsApi('pastry-chef', {
      'POST /api/labels/runs': {
        status: 422,
        body: {
          statusCode: 422,
          code: 'label-refused',
          message: 'The labels cannot be printed.',
          fields: [{ path: 'items.0.product', message: 'A case label needs the case GTIN-14; Spelt loaf has none.' }],
        },
      },
    });
    const { user } = renderApp('/labels');
    await user.selectOptions(await screen.findByLabelText('Template'), 'case');
    await user.type(screen.getByLabelText('Cases of Spelt loaf'), '2');
    await user.click(screen.getByRole('button', { name: 'Print' }));
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('Nothing was printed')).toBeInTheDocument();
    expect(within(alert).getByText('Spelt loaf:')).toBeInTheDocument();
    expect(within(alert).getByText(/has none/)).toBeInTheDocument();
  });

  it('refuses a batch code with a character GS1 does not allow before anything is sent', async () => {
    const { calls } = labelsApi('manager');
    const { user } = renderApp('/labels');
    await user.type(await screen.findByLabelText('Labels of Lemon tart'), '10');
    await user.type(screen.getByLabelText('Batch code for this run'), 'B 7');
    await user.click(screen.getByRole('button', { name: 'Print' }));
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText(/character set 82.*'B 7' has a space/)).toBeInTheDocument();
    expect(calls.some((c) => c.method === 'POST')).toBe(false);
  });

  it('searches the log by batch, marks a run whose revision is no longer current, and prints it again only with a manager’s reason', async () => {
    const old = run({ id: 17, current: false, items: [{ ...run().items[0]!, revision: 5, batch: '261120-LEMONT-2' }] });
    const { calls } = labelsApi('manager', {
      'GET /api/labels/runs': ({ url }) => ({
        body: new URL(url, 'http://x').searchParams.get('batch') === '261120-LEMONT-2' ? [old] : [],
      }),
      'POST /api/labels/runs': {
        status: 201,
        body: run({ id: 43, override: { reason: 'Customer asked for a copy of the November case labels.' } }),
      },
    });
    const { user } = renderApp('/labels');
    const log = await screen.findByRole('region', { name: 'Print log' });
    await user.type(within(log).getByLabelText('Batch code'), '261120-LEMONT-2');
    const table = await within(log).findByRole('region', { name: 'Print log, newest first' });
    expect(await within(table).findByText('No longer current')).toBeInTheDocument();
    expect(calls.some((c) => c.path === '/api/labels/runs' && c.method === 'GET')).toBe(true);

    await user.click(within(table).getByRole('button', { name: 'Print run 17 again' }));
    expect(screen.getByLabelText('Cases of Lemon tart')).toHaveValue(4);
    expect(screen.getByText(/^Revision 5, as logged/)).toBeInTheDocument();
    await user.type(
      screen.getByLabelText('Reason for printing a revision that is no longer current'),
      'Customer asked for a copy of the November case labels.',
    );
    await user.click(screen.getByRole('button', { name: 'Print' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'POST')).toBe(true));
    expect(calls.find((c) => c.method === 'POST')?.body).toEqual({
      template: 'case',
      productionDate: '2026-12-02',
      items: [{ product: 'lemon-tart', quantity: 4, revision: 5 }],
      override: { reason: 'Customer asked for a copy of the November case labels.' },
    });
  });

  it('is not open to front of house', async () => {
    mockApi(signedInAs('front-of-house'));
    renderApp('/labels');
    expect(await screen.findByRole('heading', { level: 1, name: 'Not available to your role' })).toBeInTheDocument();
  });
});
