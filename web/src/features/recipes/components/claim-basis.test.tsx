import type { ClaimBasis } from '@crumbproof/shared';
import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';
import { declarationFor, RECIPES, REVISIONS } from '../testing/fixtures';

async function claimsShown(claimBasis: ClaimBasis) {
  mockApi(
    signedInAs('front-of-house', {
      'GET /api/recipes': { body: RECIPES },
      'GET /api/recipes/victoria-sponge': { body: RECIPES[0] },
      'GET /api/recipes/victoria-sponge/declaration': { body: declarationFor({ claimBasis }) },
      'GET /api/recipes/victoria-sponge/revisions': { body: REVISIONS },
    }),
  );
  renderApp('/recipes/victoria-sponge');
  return screen.findByRole('region', { name: 'What the recipe supports' });
}

describe('Claims that hold, with what they stand on', () => {
  it('says every ingredient was checked against a specification on file, with the filed-sheet mark', async () => {
    const claims = await claimsShown({ checked: 12, statementOnly: [] });
    const vegetarian = within(claims).getByText('Vegetarian: Holds').closest('li')!;
    const basis = within(vegetarian).getByTestId('claim-basis');
    expect(basis).toHaveTextContent('All 12 ingredients checked against a specification on file.');
    expect(basis.querySelector('[data-basis-mark="sheet"]')).toHaveAttribute('aria-hidden', 'true');
    expect(basis.querySelector('[data-basis-mark="bubble"]')).toBeNull();
    expect(within(claims).queryByTestId('claim-basis-leaves')).toBeNull();
    expect(claims).not.toHaveTextContent(/supplier statement|\bsafe\b/i);
  });

  it('says a claim holds on supplier statements, naming each ingredient and why, with the speech-bubble mark', async () => {
    const claims = await claimsShown({
      checked: 12,
      statementOnly: [
        { id: 'caster-sugar', name: 'Caster sugar', why: 'no-specification' },
        { id: 'butter', name: 'Butter', why: 'review-overdue', reviewBy: '2026-11-28' },
        { id: 'jam', name: 'Raspberry jam', why: 'no-specification' },
      ],
    });
    expect(within(claims).queryByText('Vegetarian: Holds')).toBeNull();
    const vegetarian = within(claims).getByText('Vegetarian: Holds on supplier statements').closest('li')!;
    const basis = within(vegetarian).getByTestId('claim-basis');
    expect(basis).toHaveTextContent(
      '3 of 12 ingredients have no specification on file or one past its review date, so the claim rests on what the supplier states (named below).',
    );
    // The ingredients are named once, beneath every claim, with why each.
    expect(within(claims).getByTestId('claim-basis-leaves')).toHaveTextContent(
      'Resting on a supplier statement alone: Caster sugar (no specification), Butter (specification due for review on 2026-11-28) and Raspberry jam (no specification).',
    );
    expect(basis.querySelector('[data-basis-mark="bubble"]')).toHaveAttribute('aria-hidden', 'true');
    expect(basis.querySelector('[data-basis-mark="sheet"]')).toBeNull();
    expect(claims).not.toHaveTextContent(/\bsafe\b/i);
  });

  it('gives a claim that fails or is not verified its reasons and no basis', async () => {
    const claims = await claimsShown({ checked: 12, statementOnly: [{ id: 'jam', name: 'Raspberry jam', why: 'no-specification' }] });
    const vegan = within(claims).getByText('Vegan: Fails').closest('li')!;
    expect(within(vegan).queryByTestId('claim-basis')).toBeNull();
    const sesame = within(claims).getByText('Sesame-free: Not verified').closest('li')!;
    expect(within(sesame).queryByTestId('claim-basis')).toBeNull();
    // Every claim that holds says it once; the reasons stay with those that do not.
    const holding = within(claims).getAllByText(/: Holds on supplier statements$/);
    expect(within(claims).getAllByTestId('claim-basis')).toHaveLength(holding.length);
  });
});
