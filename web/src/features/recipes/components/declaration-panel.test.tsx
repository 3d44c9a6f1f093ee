import type { SulphiteResult } from '@crumbproof/shared';
import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';
import { declarationFor, RECIPES, REVISIONS } from '../testing/fixtures';
import { CLAIMS_SUPPORTED_TITLE } from './declaration-panel';

function showProduct(sulphites: SulphiteResult) {
  mockApi(
    signedInAs('front-of-house', {
      'GET /api/recipes': { body: RECIPES },
      'GET /api/recipes/victoria-sponge': { body: RECIPES[0] },
      'GET /api/recipes/victoria-sponge/declaration': { body: declarationFor({ sulphites }) },
      'GET /api/recipes/victoria-sponge/revisions': { body: REVISIONS },
    }),
  );
  renderApp('/recipes/victoria-sponge');
}

const STATES: Array<{ what: string; sulphites: SulphiteResult; says: string; never?: RegExp }> = [
  {
    what: 'not known: names every ingredient missing data, and never says not declared',
    sulphites: {
      status: 'not-known',
      mgPerKg: null,
      statedMgPerKg: 5,
      declared: false,
      missing: [
        { ingredient: 'strands', name: 'Sugar strands', reason: 'no-allergen-statement' },
        { ingredient: 'cherries', name: 'Glacé cherries', reason: 'no-allergen-statement' },
      ],
    },
    says: 'Sulphites: Not known: Sugar strands and Glacé cherries have no allergen statement and no stated sulphite content, so the product cannot be shown to be below the threshold. Record their allergen statement or sulphite content before labelling.',
    never: /not declared|5 mg\/kg/,
  },
  {
    what: 'declared with the amount not stated: names the sulphite source with no figure',
    sulphites: {
      status: 'declared',
      mgPerKg: null,
      statedMgPerKg: 0,
      declared: true,
      missing: [{ ingredient: 'apricots', name: 'Dried apricots', reason: 'content-not-stated' }],
    },
    says: 'Sulphites: Declared: contains sulphites, amount not stated (Dried apricots has no stated content).',
  },
  {
    what: 'declared with the figure as eaten',
    sulphites: { status: 'declared', mgPerKg: 11.1111, statedMgPerKg: 11.1111, declared: true, missing: [] },
    says: 'Sulphites: Declared: 11.11 mg/kg as eaten, above the threshold.',
  },
  {
    what: 'declared on the stated contents alone, the total not known',
    sulphites: {
      status: 'declared',
      mgPerKg: null,
      statedMgPerKg: 15,
      declared: true,
      missing: [{ ingredient: 'strands', name: 'Sugar strands', reason: 'no-allergen-statement' }],
    },
    says: 'Sulphites: Declared: the stated contents alone give 15 mg/kg as eaten, above the threshold; the total is not known (Sugar strands has no allergen statement).',
  },
  {
    what: 'below the threshold with the figure',
    sulphites: { status: 'below-threshold', mgPerKg: 5, statedMgPerKg: 5, declared: false, missing: [] },
    says: 'Sulphites: Below the threshold: 5 mg/kg as eaten, not declared.',
  },
];

describe('Declaration panel: sulphites in words', () => {
  it.each(STATES)('$what', async ({ sulphites, says, never }) => {
    showProduct(sulphites);
    const printed = await screen.findByRole('region', { name: 'Ingredients as printed' });
    const line = within(printed)
      .getByText(/^Sulphites:/)
      .closest('p')!;
    expect(line).toHaveTextContent(says);
    if (never) expect(line).not.toHaveTextContent(never);
  });
});

describe('Declaration panel: a shortened path list says what it left out', () => {
  it('counts the paths not drawn, under the allergen and under the claim reason', async () => {
    const base = declarationFor();
    const butterVia = ['victoria-sponge', 'vanilla-sponge', 'butter'];
    mockApi(
      signedInAs('front-of-house', {
        'GET /api/recipes': { body: RECIPES },
        'GET /api/recipes/victoria-sponge': { body: RECIPES[0] },
        'GET /api/recipes/victoria-sponge/declaration': {
          body: {
            ...base,
            contains: base.contains.map((c) => (c.allergen === 'milk' ? { ...c, viaMore: 11 } : c)),
            claims: {
              ...base.claims,
              vegan: { status: 'fails', reasons: [{ leaf: 'butter', path: butterVia, message: 'Butter contains milk.', morePaths: 1 }] },
            },
          },
        },
        'GET /api/recipes/victoria-sponge/revisions': { body: REVISIONS },
      }),
    );
    renderApp('/recipes/victoria-sponge');
    const contains = await screen.findByRole('region', { name: 'Contains' });
    expect(within(contains).getByText('And 11 more paths through the same parts of Victoria sponge, not drawn.')).toBeVisible();
    // Wheat's list was not shortened: no count under it.
    expect(within(contains).getAllByText(/more paths? through the same parts/)).toHaveLength(1);
    const claims = screen.getByRole('region', { name: CLAIMS_SUPPORTED_TITLE });
    expect(within(claims).getByText(/, and by 1 other path through Vanilla sponge\)/)).toBeVisible();
  });
});
