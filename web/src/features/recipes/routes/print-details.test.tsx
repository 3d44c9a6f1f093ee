import { caseGtinFromUnit, type BookRecipe } from '@crumbproof/shared';
import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs, type ApiHandlers } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';
import { declarationFor, INGREDIENTS, RECIPES } from '../testing/fixtures';

const SETTINGS = { batchPattern: '{YY}{MM}{DD}-{P}-{N}', gs1CompanyPrefix: '5069990', ssccExtension: 0, caseIndicator: 3 };

function editorApi(extra: ApiHandlers = {}) {
  return mockApi(
    signedInAs('pastry-chef', {
      'GET /api/recipes': { body: RECIPES },
      'GET /api/ingredients': { body: INGREDIENTS },
      'GET /api/recipes/victoria-sponge': { body: RECIPES[0] },
      'GET /api/labels/settings': { body: SETTINGS },
      'POST /api/declarations/preview': { body: declarationFor() },
      'GET /api/recipes/victoria-sponge/declaration': { body: declarationFor() },
      'GET /api/recipes/victoria-sponge/revisions': { body: [] },
      ...extra,
    }),
  );
}

/** Puts text into a box as a paste: typing it key by key is slow on a busy machine and tests nothing more here. */
async function fill(user: ReturnType<typeof renderApp>['user'], label: string, text: string) {
  await user.click(screen.getByLabelText(label));
  await user.paste(text);
}

describe('Recipe editor: print details', () => {
  it('says as a GTIN is typed whether its check digit holds, naming the digit it should be', async () => {
    editorApi();
    const { user } = renderApp('/recipes/victoria-sponge/edit');
    const gtin = await screen.findByLabelText('GTIN of one unit');

    // GS1 General Specifications' worked example: 629104150021 takes check digit 3.
    await user.type(gtin, '6291041');
    expect(await screen.findByText('7 digits so far; a GTIN has 8, 12 or 13.')).toBeInTheDocument();
    expect(gtin).not.toHaveAttribute('aria-invalid', 'true');
    await user.paste('500219');
    expect(await screen.findByText(/The check digit of 6291041500219 should be 3, not 9/)).toBeInTheDocument();
    expect(gtin).toHaveAttribute('aria-invalid', 'true');

    await user.clear(gtin);
    await fill(user, 'GTIN of one unit', '6291041500213');
    expect(await screen.findByText('GTIN-13: the check digit 3 is right.')).toBeInTheDocument();
    expect(gtin).not.toHaveAttribute('aria-invalid', 'true');
  });

  it('derives the case GTIN-14 with the kitchen’s indicator digit and saves every print detail with the recipe', async () => {
    let saved: BookRecipe | null = null;
    editorApi({
      'PUT /api/recipes/victoria-sponge': ({ body }) => {
        saved = body as BookRecipe;
        return { body: { ...(body as BookRecipe), revision: 5, updatedAt: '2026-12-01T19:00:00.000Z' } };
      },
    });
    const { user, router } = renderApp('/recipes/victoria-sponge/edit');
    await user.selectOptions(await screen.findByLabelText('Date mark'), 'use-by');
    await fill(user, 'Shelf life (days)', '3');
    await fill(user, 'Storage', 'Keep refrigerated at 0–5 °C');
    await fill(user, 'Net weight (g)', '450');
    await fill(user, 'GTIN of one unit', '6291041500213');
    await fill(user, 'Units per case', '6');
    expect(await screen.findByText(/case indicator digit 3/)).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Derive from the unit GTIN' }));
    // Indicator 3, the unit's first 12 digits after its leading zero, and a new check digit (GS1 modulo 10).
    expect(screen.getByLabelText('Case GTIN-14')).toHaveValue('36291041500214');
    expect(caseGtinFromUnit('6291041500213', 3)).toBe('36291041500214');

    await user.click(screen.getByRole('button', { name: 'Save recipe' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/recipes/victoria-sponge'));
    expect(saved!.sale).toEqual({
      portionG: 90,
      claims: ['vegetarian'],
      quid: ['jam'],
      dateMark: 'use-by',
      shelfLifeDays: 3,
      storage: 'Keep refrigerated at 0–5 °C',
      netWeightG: 450,
      gtin: '6291041500213',
      unitsPerCase: 6,
      caseGtin: '36291041500214',
    });
  });

  it('keeps a product’s print details when the recipe is saved with other changes, and refuses a date mark without a shelf life', async () => {
    const withDetails = {
      ...RECIPES[0]!,
      sale: { ...RECIPES[0]!.sale!, dateMark: 'best-before' as const, shelfLifeDays: 5, gtin: '6291041500213', unitsPerCase: 12 },
    };
    const { calls } = editorApi({ 'GET /api/recipes/victoria-sponge': { body: withDetails } });
    const { user } = renderApp('/recipes/victoria-sponge/edit');
    expect(await screen.findByLabelText('Date mark')).toHaveValue('best-before');
    expect(screen.getByLabelText('Shelf life (days)')).toHaveValue(5);
    expect(screen.getByLabelText('GTIN of one unit')).toHaveValue('6291041500213');

    await user.clear(screen.getByLabelText('Shelf life (days)'));
    await user.click(screen.getByRole('button', { name: 'Save recipe' }));
    expect(await screen.findByText('Give the shelf life in days for the date mark.')).toBeInTheDocument();
    expect(calls.some((c) => c.method === 'PUT')).toBe(false);
  });
});
