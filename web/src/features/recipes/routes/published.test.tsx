import type { BookRecipe, RecipeView } from '@crumbproof/shared';
import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';
import { declarationFor, INGREDIENTS, RECIPES } from '../testing/fixtures';

/** The editor on Victoria sponge as given, saving into `saved`. */
function editorOn(recipe: RecipeView) {
  const saves: BookRecipe[] = [];
  mockApi(
    signedInAs('pastry-chef', {
      'GET /api/recipes': { body: RECIPES },
      'GET /api/ingredients': { body: INGREDIENTS },
      'GET /api/recipes/victoria-sponge': { body: recipe },
      'POST /api/declarations/preview': { body: declarationFor() },
      'GET /api/recipes/victoria-sponge/declaration': { body: declarationFor() },
      'GET /api/recipes/victoria-sponge/revisions': { body: [] },
      'PUT /api/recipes/victoria-sponge': ({ body }) => {
        saves.push(body as BookRecipe);
        return { body: { ...(body as BookRecipe), revision: 5, updatedAt: '2026-12-02T09:00:00.000Z' } };
      },
    }),
  );
  return { saves, ...renderApp('/recipes/victoria-sponge/edit') };
}

describe('Recipe editor: published on the public page', () => {
  it('publishes a product for sale, keeping the rest of its sale details', async () => {
    const { saves, user, router } = editorOn(RECIPES[0]!);
    const box = await screen.findByRole('checkbox', { name: /Published on the public page/ });
    expect(box).not.toBeChecked();
    // The hint is read with the box's name.
    expect(box).toHaveAccessibleName(/public product page/);
    await user.click(box);
    await user.click(screen.getByRole('button', { name: 'Save recipe' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/recipes/victoria-sponge'));
    expect(saves.map((s) => s.sale)).toEqual([{ portionG: 90, claims: ['vegetarian'], quid: ['jam'], published: true }]);
  });

  it('shows a published product ticked, and unpublishing leaves the field out as before', async () => {
    const published = { ...RECIPES[0]!, sale: { ...RECIPES[0]!.sale!, published: true } };
    const { saves, user, router } = editorOn(published);
    const box = await screen.findByRole('checkbox', { name: /Published on the public page/ });
    await waitFor(() => expect(box).toBeChecked());
    await user.click(box);
    await user.click(screen.getByRole('button', { name: 'Save recipe' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/recipes/victoria-sponge'));
    expect(saves.map((s) => s.sale)).toEqual([{ portionG: 90, claims: ['vegetarian'], quid: ['jam'] }]);
  });

  it('offers no publishing for a recipe that is not for sale', async () => {
    const { user } = editorOn(RECIPES[0]!);
    const forSale = await screen.findByRole('checkbox', { name: 'For sale' });
    await user.click(forSale);
    expect(screen.queryByRole('checkbox', { name: /Published on the public page/ })).not.toBeInTheDocument();
  });
});
