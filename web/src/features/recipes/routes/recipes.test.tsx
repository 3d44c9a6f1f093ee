import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';
import { declarationFor, RECIPES } from '../testing/fixtures';

function listApi(role: 'manager' | 'front-of-house') {
  return mockApi(
    signedInAs(role, {
      'GET /api/recipes': { body: RECIPES },
      'GET /api/declarations': {
        body: [declarationFor({ errors: [{ code: 'species-missing', message: 'Name the species.' }] })],
      },
    }),
  );
}

describe('Recipes list', () => {
  it('lists recipes and products with kind, claims held, errors, when each declaration was worked out, revision and date', async () => {
    listApi('manager');
    renderApp('/recipes');

    expect(await screen.findByRole('heading', { level: 1, name: 'Recipes' })).toBeInTheDocument();
    const table = await screen.findByRole('table', { name: 'Recipes and products' });
    expect(
      within(table)
        .getAllByRole('columnheader')
        .map((h) => h.textContent),
    ).toEqual(['Name', 'Kind', 'What the recipe supports', 'Errors', 'Declaration worked out', 'Revision', 'Updated']);
    const product = within(table).getByRole('link', { name: 'Victoria sponge' });
    expect(product).toHaveAttribute('href', '/recipes/victoria-sponge');
    const row = product.closest('tr')!;
    expect(await within(row).findByText('Vegetarian, Nut-free, Peanut-free')).toBeInTheDocument();
    expect(within(row).getByText('1 error: labels blocked')).toBeInTheDocument();
    expect(within(row).getByText('For sale')).toBeInTheDocument();
    expect(within(row).getByText('28 Nov 2026')).toBeInTheDocument();
    expect(within(row).getByText('28 Nov 2026, 10:42, from revision 4')).toBeInTheDocument();

    const sub = within(table).getByRole('link', { name: 'Vanilla sponge' }).closest('tr')!;
    expect(within(sub).getByText('Sub-recipe')).toBeInTheDocument();

    expect(screen.getByRole('link', { name: 'New recipe' })).toHaveAttribute('href', '/recipes/new');
    expect(screen.getByRole('link', { name: 'Swap check' })).toHaveAttribute('href', '/recipes/swap');
  });

  it('says so when a declaration was worked out from an earlier revision than the one listed', async () => {
    const served = declarationFor();
    mockApi(
      signedInAs('manager', {
        'GET /api/recipes': { body: RECIPES },
        'GET /api/declarations': {
          body: [
            { ...served, basis: { ...served.basis, items: [{ ...served.basis.items[0]!, revision: 3 }, ...served.basis.items.slice(1)] } },
          ],
        },
      }),
    );
    renderApp('/recipes');

    const row = (await screen.findByRole('link', { name: 'Victoria sponge' })).closest('tr')!;
    expect(await within(row).findByText('28 Nov 2026, 10:42, from revision 3 (the recipe is now at revision 4)')).toBeInTheDocument();
  });

  it('filters by the search box', async () => {
    listApi('manager');
    const { user } = renderApp('/recipes');

    await screen.findByRole('link', { name: 'Vanilla sponge' });
    await user.type(screen.getByRole('searchbox', { name: 'Search recipes' }), 'victoria');
    expect(screen.getByRole('link', { name: 'Victoria sponge' })).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'Vanilla sponge' })).not.toBeInTheDocument();
  });

  it('is read-only for front of house', async () => {
    listApi('front-of-house');
    renderApp('/recipes');

    expect(await screen.findByRole('link', { name: 'Victoria sponge' })).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'New recipe' })).not.toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'Swap check' })).not.toBeInTheDocument();
  });
});
