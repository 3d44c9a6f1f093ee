import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { QUID_KIND } from '@/components/ui/percent-kinds';
import { mockApi, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';
import { DECLARATION_CAUTION } from '../components/declaration-panel';
import { declarationFor, RECIPES, REVISIONS } from '../testing/fixtures';

function productApi(role: 'manager' | 'front-of-house' = 'manager', declaration = declarationFor()) {
  return mockApi(
    signedInAs(role, {
      'GET /api/recipes': { body: RECIPES },
      'GET /api/recipes/victoria-sponge': { body: RECIPES[0] },
      'GET /api/recipes/victoria-sponge/declaration': ({ url }) => ({
        body: { ...declaration, regime: new URL(url, 'http://x').searchParams.get('regime') ?? 'UK' },
      }),
      'GET /api/recipes/victoria-sponge/revisions': { body: REVISIONS },
    }),
  );
}

function region(name: string) {
  return screen.getByRole('region', { name });
}

describe('Product page: the declaration panel', () => {
  it('shows each allergen group in bold with its sources and a layer path per route to the leaf', async () => {
    productApi();
    renderApp('/recipes/victoria-sponge');

    expect(await screen.findByRole('heading', { level: 1, name: 'Victoria sponge' })).toBeInTheDocument();
    const contains = await screen.findByRole('region', { name: 'Contains' });
    const milk = within(contains).getByText('milk', { selector: 'strong' });
    expect(milk.closest('li')).toHaveTextContent('Contains milk');

    const path = within(contains).getByRole('list', { name: 'Layer path: Victoria sponge → Vanilla sponge → Butter' });
    const bars = within(path).getAllByRole('link');
    expect(bars.map((bar) => bar.textContent)).toEqual(['Victoria sponge', 'Vanilla sponge', 'Butter']);
    expect(bars.map((bar) => bar.getAttribute('href'))).toEqual([
      '/recipes/victoria-sponge',
      '/recipes/vanilla-sponge',
      '/ingredients/butter',
    ]);
    // Gluten reaches the product twice: through the sponge and through the dusting flour.
    expect(within(contains).getAllByRole('list', { name: /^Layer path: .* → Plain wheat flour$/ })).toHaveLength(2);
    // The dusting flour's gluten is said to come through contact, and stays under contains.
    const gluten = within(contains).getByText('cereals containing gluten', { selector: 'strong' }).closest('li')!;
    expect(gluten).toHaveTextContent(
      'From contact with Plain wheat flour (a contact line: greasing or dusting): it is still in the food, so it is declared here, not as a may-contain.',
    );
    expect(milk.closest('li')).not.toHaveTextContent('From contact');
  });

  it('warns, beside the basis, of an ingredient whose specification is overdue for review, and shows the declaration all the same', async () => {
    const message =
      "The supplier specification of Butter was due for review on 2026-11-28; this declaration uses what it recorded. Check it against the supplier's current specification.";
    productApi('front-of-house', {
      ...declarationFor(),
      reviewWarnings: [{ ingredient: 'butter', name: 'Butter', reviewBy: '2026-11-28', message }],
    });
    renderApp('/recipes/victoria-sponge');
    const warning = await screen.findByRole('region', { name: 'Specifications overdue for review' });
    expect(warning).toHaveTextContent('Specification overdue for review: Butter');
    expect(warning).toHaveTextContent(message);
    expect(screen.getByRole('region', { name: 'Contains' })).toBeInTheDocument();
  });

  it('shows no review warning when every specification is current', async () => {
    productApi();
    renderApp('/recipes/victoria-sponge');
    expect(await screen.findByRole('region', { name: 'Contains' })).toBeInTheDocument();
    expect(screen.queryByRole('region', { name: 'Specifications overdue for review' })).not.toBeInTheDocument();
  });

  it('gives every claim its status word, and the reasons with their paths', async () => {
    productApi();
    renderApp('/recipes/victoria-sponge');

    const claims = await screen.findByRole('region', { name: 'What the recipe supports' });
    expect(within(claims).getByText('Vegan: Fails')).toBeInTheDocument();
    expect(within(claims).getByText('Vegetarian: Holds')).toBeInTheDocument();
    expect(within(claims).getByText('Sesame-free: Not verified')).toBeInTheDocument();
    const vegan = within(claims).getByText('Vegan: Fails').closest('li')!;
    expect(vegan).toHaveTextContent('Butter contains milk.');
    expect(within(vegan).getByRole('link', { name: 'Vanilla sponge' })).toHaveAttribute('href', '/recipes/vanilla-sponge');
    // The marks are decoration; the words carry the status.
    expect(vegan.querySelector('[data-claim-mark="fails"]')).toHaveAttribute('aria-hidden', 'true');
  });

  it('keeps the claims the kitchen wants apart from what the recipe supports', async () => {
    productApi();
    renderApp('/recipes/victoria-sponge');

    const claims = await screen.findByRole('region', { name: 'What the recipe supports' });
    // The sale details want vegetarian only: a claim that holds is not thereby wanted, and the reverse.
    expect(within(claims).getByText('Vegetarian: Holds').closest('li')).toHaveTextContent('You want to make this claim.');
    expect(within(claims).getByText('Vegan: Fails').closest('li')).toHaveTextContent('Not among the claims you want to make.');
    expect(
      within(claims)
        .getAllByTestId('claim-wanted')
        .filter((n) => n.textContent === 'You want to make this claim.'),
    ).toHaveLength(1);
  });

  it('prints the ingredient list with allergens emphasised, and the may contain, not known, QUID and caution', async () => {
    productApi();
    renderApp('/recipes/victoria-sponge');

    const printed = await screen.findByRole('region', { name: 'Ingredients as printed' });
    const list = within(printed).getByTestId('ingredients-text');
    expect(list).toHaveTextContent('Vanilla sponge (wheat flour, butter (milk), eggs), raspberry jam (16%).');
    expect([...list.querySelectorAll('strong')].map((node) => node.textContent)).toEqual(['wheat', 'milk', 'eggs']);
    expect(within(printed).getByText('May contain: sesame.')).toBeInTheDocument();
    expect(within(printed).getByText('Raspberry jam 17%')).toBeInTheDocument();
    // The QUID is the engine's printed text, its basis and rounding said once beside it.
    expect(within(printed).getByTestId('quid-kind')).toHaveTextContent(QUID_KIND);

    expect(within(region('May contain')).getByText('Sesame: shared equipment in this kitchen')).toBeInTheDocument();
    const notKnown = region('Not known');
    expect(within(notKnown).getByText('Raspberry jam', { selector: 'strong' }).closest('li')).toHaveTextContent('Not known Raspberry jam');
    expect(notKnown.querySelector('[data-mark="dashed"]')).not.toBeNull();

    expect(screen.getByText(DECLARATION_CAUTION)).toBeVisible();
    expect(DECLARATION_CAUTION).toContain('Check it against current supplier specifications before relying on it');
  });

  it('says labels cannot be printed while the declaration has errors', async () => {
    productApi('manager', declarationFor({ errors: [{ code: 'species-missing', message: 'Name the fish species in Anchovy paste.' }] }));
    renderApp('/recipes/victoria-sponge');

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Labels cannot be printed until these are fixed');
    expect(alert).toHaveTextContent('Name the fish species in Anchovy paste.');
  });

  it('switches regime and asks the API for that regime’s declaration', async () => {
    const { calls } = productApi();
    const { user } = renderApp('/recipes/victoria-sponge');

    const select = await screen.findByRole('combobox', { name: 'Regime' });
    await waitFor(() => expect(select).toHaveValue('UK'));
    await user.selectOptions(select, 'US');
    await waitFor(() =>
      expect(calls.some((call) => call.path === '/api/recipes/victoria-sponge/declaration' && call.method === 'GET')).toBe(true),
    );
    await waitFor(() => expect(screen.getByRole('combobox', { name: 'Regime' })).toHaveValue('US'));
    const urls = (globalThis.fetch as unknown as { mock: { calls: [string][] } }).mock.calls.map(([url]) => url);
    expect(urls).toContain('/api/recipes/victoria-sponge/declaration?regime=UK');
    expect(urls).toContain('/api/recipes/victoria-sponge/declaration?regime=US');
  });

  it('says which kitchen the declaration answers for, and under which rules', async () => {
    const { calls } = productApi('front-of-house');
    const { user } = renderApp('/recipes/victoria-sponge');

    expect(await screen.findByText('Declared for Larch Street Bakehouse (UK rules)')).toBeInTheDocument();
    await user.selectOptions(await screen.findByRole('combobox', { name: 'Regime' }), 'US');
    expect(await screen.findByText('Declared for Larch Street Bakehouse (US rules)')).toBeInTheDocument();
    expect(calls.filter((call) => call.path === '/api/recipes/victoria-sponge/declaration').every((call) => call.kitchen === '1')).toBe(
      true,
    );
  });
});

describe('Product page: nutrition', () => {
  it('shows the EU/UK table per 100 g and per portion, and the per-serving table with %DV', async () => {
    productApi();
    renderApp('/recipes/victoria-sponge');

    const nutrition = await screen.findByRole('region', { name: 'Nutrition' });
    const eu = within(nutrition).getByRole('table', { name: 'Nutrition declaration (EU and UK): as this kitchen prints it' });
    expect(
      within(eu)
        .getAllByRole('columnheader')
        .map((h) => h.textContent),
    ).toEqual(['Nutrient', 'Per 100 g', 'Per portion (90 g)']);
    const fat = within(eu).getByText('Fat').closest('tr')!;
    expect(
      within(fat)
        .getAllByRole('cell')
        .map((c) => c.textContent),
    ).toEqual(['Fat', '21 g', '18.9 g']);

    const us = within(nutrition).getByRole('table', { name: 'Nutrition per serving (90 g), United States' });
    expect(
      within(us)
        .getAllByRole('columnheader')
        .map((h) => h.textContent),
    ).toEqual(['Nutrient', 'Amount per serving', '% Daily Value']);
    const totalFat = within(us).getByText('Total Fat').closest('tr')!;
    expect(
      within(totalFat)
        .getAllByRole('cell')
        .map((c) => c.textContent),
    ).toEqual(['Total Fat', '19g', '24%']);
  });

  it('marks incomplete figures as Incomplete and names the ingredients that lack them', async () => {
    productApi();
    renderApp('/recipes/victoria-sponge');

    const nutrition = await screen.findByRole('region', { name: 'Nutrition' });
    const eu = within(nutrition).getByRole('table', { name: 'Nutrition declaration (EU and UK): as this kitchen prints it' });
    const fibre = within(eu).getByText('Fibre').closest('tr')!;
    expect(
      within(fibre)
        .getAllByRole('cell')
        .map((c) => c.textContent),
    ).toEqual(['Fibre', 'Incomplete', 'Incomplete']);
    expect(within(nutrition).getByText('Incomplete: Fibre')).toBeInTheDocument();
    expect(within(nutrition).getByText('Fibre: no figure recorded for Raspberry jam')).toBeInTheDocument();
    // Never printed as zero.
    expect(within(fibre).queryByText(/^0/)).not.toBeInTheDocument();
  });

  it('tells where each figure comes from, one click away', async () => {
    productApi();
    const { user } = renderApp('/recipes/victoria-sponge');

    const nutrition = await screen.findByRole('region', { name: 'Nutrition' });
    const butter = within(nutrition).getByRole('link', { name: 'Butter' });
    expect(butter).not.toBeVisible();
    await user.click(within(nutrition).getByText('Where the figures come from'));
    expect(butter).toBeVisible();
    expect(butter).toHaveAttribute('href', '/ingredients/butter');
    expect(butter.closest('li')).toHaveTextContent('Butter: Supplier specification, Oct 2026');
    expect(within(nutrition).getByRole('link', { name: 'Raspberry jam' }).closest('li')).toHaveTextContent('no nutrition recorded');
  });
});

describe('Product page: writers and readers', () => {
  it('gives writers the edit link and the revision history, with what each revision changed', async () => {
    productApi('manager');
    const { user } = renderApp('/recipes/victoria-sponge');

    expect(await screen.findByRole('link', { name: 'Edit recipe' })).toHaveAttribute('href', '/recipes/victoria-sponge/edit');
    const history = await screen.findByRole('region', { name: 'Revision history' });
    const latest = await within(history).findByText('Revision 4');
    const item = latest.closest('li')!;
    expect(item).toHaveTextContent('Teodor Lind');
    expect(item).toHaveTextContent('Swapped Margarine for Butter');
    expect(item).toHaveTextContent('Allergens added');
    expect(within(item).getByText('milk', { selector: 'strong' })).toBeInTheDocument();
    expect(item).toHaveTextContent('No longer may contain soy');
    expect(within(item).getByText('Vegan: Holds → Fails')).toBeInTheDocument();
    // What the label prints changed too: the ingredient list and the may-contain line, before and after.
    const printed = (id: string) => [...within(item).getByTestId(id).querySelectorAll('dd')].map((cell) => cell.textContent);
    expect(printed('ingredients-text-change')).toEqual(['Wheat flour, sugar, soya spread (soya).', 'Wheat flour, sugar, butter (milk).']);
    expect(printed('may-contain-text-change')).toEqual(['May contain: soya.', 'No may-contain line.']);

    // The latest three show; the first revision waits behind a button.
    expect(within(history).queryByText('Revision 1')).not.toBeInTheDocument();
    await user.click(within(history).getByRole('button', { name: 'Show 1 earlier revision' }));
    expect(within(history).getByText('Revision 1').closest('li')).toHaveTextContent('The first revision');
  });

  it('shows front of house the declaration read-only: no edit link, no history', async () => {
    const { calls } = productApi('front-of-house');
    renderApp('/recipes/victoria-sponge');

    expect(await screen.findByRole('region', { name: 'What the recipe supports' })).toBeInTheDocument();
    expect(screen.getByRole('heading', { level: 1, name: 'Victoria sponge' })).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'Edit recipe' })).not.toBeInTheDocument();
    expect(screen.queryByRole('region', { name: 'Revision history' })).not.toBeInTheDocument();
    expect(calls.some((call) => call.path.endsWith('/revisions'))).toBe(false);
    // Ingredient pages are not theirs to open: the leaf bar names the ingredient without a link.
    const path = within(region('Contains')).getByRole('list', { name: 'Layer path: Victoria sponge → Vanilla sponge → Butter' });
    expect(
      within(path)
        .getAllByRole('link')
        .map((link) => link.getAttribute('href')),
    ).toEqual(['/recipes/victoria-sponge', '/recipes/vanilla-sponge']);
    expect(within(path).getByText('Butter')).toBeInTheDocument();
  });
});

describe('Product page: what the declaration was worked out from', () => {
  function basisNote() {
    return screen.findByRole('note', { name: 'What this declaration was worked out from' });
  }

  it('says when it was worked out and from which revisions, in one line above the declaration', async () => {
    const today = new Date();
    today.setHours(10, 42, 0, 0);
    const served = declarationFor();
    productApi('manager', { ...served, basis: { ...served.basis, computedAt: today.toISOString() } });
    renderApp('/recipes/victoria-sponge');

    const note = await basisNote();
    expect(note).toHaveTextContent(
      'Worked out 10:42 from revision 4 of this recipe, 1 sub-recipe and 4 ingredients at their current revisions, with version 3 of the kitchen settings.',
    );
    expect(within(note).getByText('10:42')).toHaveAttribute('datetime', today.toISOString());
  });

  it('gives the day as well when it was worked out on an earlier day', async () => {
    const served = declarationFor();
    productApi('manager', { ...served, basis: { ...served.basis, computedAt: new Date(2026, 10, 28, 9, 5).toISOString() } });
    renderApp('/recipes/victoria-sponge');

    expect(await basisNote()).toHaveTextContent(/^Worked out 28 Nov 2026, 09:05 from revision 4 of this recipe/);
  });

  it('lists every sub-recipe and ingredient with its revision, each opening its page', async () => {
    productApi('manager');
    const { user } = renderApp('/recipes/victoria-sponge');

    const note = await basisNote();
    await user.click(within(note).getByText('The revisions it used'));
    const items = within(note)
      .getAllByRole('listitem')
      .map((item) => item.textContent);
    expect(items).toEqual([
      'Vanilla sponge, sub-recipe: revision 2',
      'Plain wheat flour, ingredient: revision 1',
      'Butter, ingredient: revision 1',
      'Free-range eggs, ingredient: revision 1',
      'Raspberry jam, ingredient: revision 1',
    ]);
    expect(within(note).getByRole('link', { name: 'Vanilla sponge' })).toHaveAttribute('href', '/recipes/vanilla-sponge');
    expect(within(note).getByRole('link', { name: 'Butter' })).toHaveAttribute('href', '/ingredients/butter');
  });

  it('names the ingredients without a link for front of house, who cannot open ingredient pages', async () => {
    productApi('front-of-house');
    renderApp('/recipes/victoria-sponge');

    const note = await basisNote();
    expect(within(note).getByRole('link', { name: 'Vanilla sponge' })).toBeInTheDocument();
    expect(within(note).queryByRole('link', { name: 'Butter' })).not.toBeInTheDocument();
    expect(within(note).getByText('Butter')).toBeInTheDocument();
  });
});
