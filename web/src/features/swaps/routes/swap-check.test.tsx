import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { MIX_SHARE_KIND, QUID_KIND } from '@/components/ui/percent-kinds';
import { mockApi, signedInAs, type ApiHandlers } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';
import { INGREDIENTS, PREVIEW, PREVIEW_KITCHENS, RECIPES } from '../testing/fixtures';

function swapApi(extra: ApiHandlers = {}) {
  return mockApi(
    signedInAs('manager', {
      'GET /api/recipes': { body: RECIPES },
      'GET /api/ingredients': { body: INGREDIENTS },
      'POST /api/swaps/preview': { body: PREVIEW },
      'POST /api/swaps/apply': { body: { recipes: [{ id: 'shortbread', revision: 4 }] } },
      ...extra,
    }),
  );
}

async function chooseSwap(user: ReturnType<typeof renderApp>['user']) {
  await user.type(await screen.findByRole('combobox', { name: 'Replace' }), 'Butt');
  await user.click(await screen.findByRole('option', { name: /Butter/ }));
  await user.type(screen.getByRole('combobox', { name: 'With' }), 'plant');
  await user.click(await screen.findByRole('option', { name: /Plant spread/ }));
}

describe('Swap check', () => {
  it('shows, for each affected product, allergens and may contain that move, each claim before → after and the reasons left', async () => {
    const { calls } = swapApi();
    const { user } = renderApp('/recipes/swap');

    expect(await screen.findByRole('heading', { level: 1, name: 'Swap check' })).toBeInTheDocument();
    await chooseSwap(user);
    // Only recipes that use Butter are offered as a scope.
    const where = screen.getByRole('combobox', { name: 'Where' });
    expect(
      within(where)
        .getAllByRole('option')
        .map((option) => option.textContent),
    ).toEqual(['Every recipe that uses it', 'Shortbread']);
    await user.click(screen.getByRole('button', { name: 'Check the swap' }));

    const result = await screen.findByRole('region', { name: 'Swap result' });
    expect(calls.find((call) => call.path === '/api/swaps/preview')?.body).toEqual({ from: 'butter', to: 'plant-spread' });
    expect(result).toHaveTextContent('Replacing Butter with Plant spread changes 1 recipe: Shortbread (1 line). 1 product is affected.');
    const product = within(result).getByRole('heading', { level: 3, name: 'Shortbread' }).closest('li')!;
    expect(product).toHaveTextContent('No longer contains milk');
    expect(product).toHaveTextContent('May contain added');
    expect(within(product).getByText('Vegan: Fails → Holds')).toBeInTheDocument();
    expect(within(product).getByText('Dairy-free: Fails (unchanged)')).toBeInTheDocument();
    const dairy = within(product).getByText('Dairy-free: Fails (unchanged)').closest('li')!;
    expect(dairy).toHaveTextContent('May contain milk: Supplier of Plant spread says it may contain milk.');
    // The printed lines, before and after, in full.
    const list = within(product).getByTestId('ingredients-text-change');
    expect(list).toHaveTextContent('Ingredient list as printed');
    const printed = (node: HTMLElement) => [...node.querySelectorAll('dt, dd')].map((cell) => cell.textContent);
    expect(printed(list)).toEqual(['Before', 'Wheat flour, butter.', 'After', 'Wheat flour, plant spread.']);
    const may = within(product).getByTestId('may-contain-text-change');
    expect(printed(may)).toEqual(['Before', 'No may-contain line.', 'After', 'May contain: milk.']);
    // Each kind of percentage says which it is, with one precision each, the rule stated beside it.
    expect(product).toHaveTextContent('Butter 44% → Butter: not given');
    expect(product).toHaveTextContent(QUID_KIND);
    expect(product).toHaveTextContent('Butter: 40.00% of the mix → not used');
    expect(product).toHaveTextContent('Plant spread: not used → 40.00% of the mix');
    expect(product).toHaveTextContent(MIX_SHARE_KIND);
  });

  it('groups the products by kitchen, each under its name with what that kitchen makes with its own ingredients', async () => {
    swapApi({ 'POST /api/swaps/preview': { body: PREVIEW_KITCHENS } });
    const { user } = renderApp('/recipes/swap');

    await chooseSwap(user);
    await user.click(screen.getByRole('button', { name: 'Check the swap' }));
    const result = await screen.findByRole('region', { name: 'Swap result' });
    expect(result).toHaveTextContent('2 products are affected at 2 kitchens of 3.');
    expect(result).toHaveTextContent('applying the swap changes them for all of them at once');
    // Every kitchen in the order given, each a region named by its kitchen.
    const groups = within(result).getAllByRole('region');
    expect(groups.map((group) => within(group).getByRole('heading', { level: 3 }).textContent)).toEqual([
      'Test bench',
      'Corner Shop',
      'Market Stall',
    ]);
    // Before the details, a line for each product at each kitchen reached, linking to its details.
    const glance = within(result).getByRole('navigation', { name: 'At a glance' });
    expect(glance).toHaveTextContent(/^At a glanceTest benchShortbread: .+Corner ShopShortbread: .+$/);
    expect(glance).not.toHaveTextContent('Market Stall');
    for (const link of within(glance).getAllByRole('link', { name: 'Shortbread' })) {
      const target = document.getElementById(link.getAttribute('href')!.slice(1));
      expect(target).toContainElement(screen.getAllByRole('heading', { level: 4, name: 'Shortbread' }).find((h) => target!.contains(h))!);
    }
    const bench = within(result).getByRole('region', { name: 'Test bench' });
    expect(bench).toHaveTextContent('United Kingdom rules · 1 product affected');
    expect(within(bench).getByRole('heading', { level: 4, name: 'Shortbread' })).toBeInTheDocument();
    expect(bench).not.toHaveTextContent('Stone-ground');

    const corner = within(result).getByRole('region', { name: 'Corner Shop' });
    expect(corner).toHaveTextContent('United States rules · 1 product affected');
    const shortbread = within(corner).getByRole('heading', { level: 4, name: 'Shortbread' }).closest('li')!;
    expect(shortbread).toHaveTextContent('Made here with Stone-ground wheat flour in place of Plain wheat flour (Shortbread, line 1).');
    const printed = (node: HTMLElement) => [...node.querySelectorAll('dt, dd')].map((cell) => cell.textContent);
    expect(printed(within(shortbread).getByTestId('ingredients-text-change'))).toEqual([
      'Before',
      'Stone-ground wheat flour, butter.',
      'After',
      'Stone-ground wheat flour, plant spread.',
    ]);

    const market = within(result).getByRole('region', { name: 'Market Stall' });
    expect(market).toHaveTextContent('no product affected');
    expect(market).toHaveTextContent('No product for sale at Market Stall changes');
    expect(within(market).queryByRole('listitem')).not.toBeInTheDocument();
  });

  it('says when a swap ends a kitchen’s own ingredient standing in', async () => {
    const [bench, corner] = PREVIEW_KITCHENS.products;
    const standIn = corner!.standIns.before[0]!;
    swapApi({
      'POST /api/swaps/preview': {
        body: {
          ...PREVIEW_KITCHENS,
          products: [
            bench!,
            {
              ...corner!,
              standIns: {
                before: [{ ...standIn, line: 2, replaces: 'butter', replacesName: 'Butter', with: 'farm-butter', withName: 'Farm butter' }],
                after: [],
              },
            },
          ],
        },
      },
    });
    const { user } = renderApp('/recipes/swap');

    await chooseSwap(user);
    await user.click(screen.getByRole('button', { name: 'Check the swap' }));
    const corner2 = within(await screen.findByRole('region', { name: 'Swap result' })).getByRole('region', { name: 'Corner Shop' });
    expect(corner2).toHaveTextContent(
      'Was made here with Farm butter in place of Butter (Shortbread, line 2); after the swap that line uses Plant spread, as the book says.',
    );
  });

  it('applies the swap after a confirmation naming how many recipes get a new revision', async () => {
    const { calls } = swapApi();
    const { user } = renderApp('/recipes/swap');

    await chooseSwap(user);
    await user.selectOptions(screen.getByRole('combobox', { name: 'Where' }), 'Shortbread');
    await user.click(screen.getByRole('button', { name: 'Check the swap' }));
    await screen.findByRole('region', { name: 'Swap result' });

    await user.click(screen.getByRole('button', { name: 'Apply swap' }));
    expect(calls.some((call) => call.path === '/api/swaps/apply')).toBe(false);
    expect(screen.getByRole('group', { name: 'Apply the swap? 1 recipe gets a new revision: Shortbread.' })).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Yes, apply to 1 recipe' }));

    const done = await screen.findByText(/^Swap applied: Butter replaced with Plant spread\./);
    expect(done).toHaveTextContent('1 recipe has a new revision.');
    expect(calls.find((call) => call.path === '/api/swaps/apply')?.body).toEqual({
      from: 'butter',
      to: 'plant-spread',
      recipe: 'shortbread',
    });
    const status = done.closest('[role="status"]') as HTMLElement;
    expect(within(status).getAllByRole('link', { name: 'Shortbread' })[0]).toHaveAttribute('href', '/recipes/shortbread');
    expect(screen.queryByRole('region', { name: 'Swap result' })).not.toBeInTheDocument();
    // The recipes list is fetched again: the swap wrote new revisions.
    await waitFor(() => expect(calls.filter((call) => call.method === 'GET' && call.path === '/api/recipes').length).toBeGreaterThan(1));
  });

  it('shows what the API says is wrong with the swap', async () => {
    swapApi({
      'POST /api/swaps/preview': {
        status: 400,
        body: {
          statusCode: 400,
          code: 'unweighable-line',
          message: "Line 2 of Shortbread uses 'plant-spread' in 'each', but Plant spread has no weight per unit.",
          fields: [{ path: 'recipes.shortbread.lines.2', message: 'Plant spread has no weight per unit.' }],
        },
      },
    });
    const { user } = renderApp('/recipes/swap');

    await chooseSwap(user);
    await user.click(screen.getByRole('button', { name: 'Check the swap' }));
    expect(await screen.findByRole('alert')).toHaveTextContent("Line 2 of Shortbread uses 'plant-spread' in 'each'");
    expect(screen.queryByRole('button', { name: 'Apply swap' })).not.toBeInTheDocument();
  });

  it('refuses front of house', async () => {
    mockApi(signedInAs('front-of-house'));
    renderApp('/recipes/swap');
    expect(await screen.findByRole('heading', { level: 1, name: 'Not available to your role' })).toBeInTheDocument();
  });
});
