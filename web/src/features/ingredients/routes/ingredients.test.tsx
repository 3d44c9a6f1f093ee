import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, requestUrl, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';
import type { IngredientView } from '@crumbproof/shared';
import { INGREDIENTS, SPEC_STATUS } from '../testing/fixtures';

function api(ingredients: IngredientView[] = INGREDIENTS) {
  return mockApi(
    signedInAs('pastry-chef', {
      // Searches and pages as the API does: q (name, id, supplier, supplier code), source, limit and offset.
      'GET /api/ingredients': ({ url }) => {
        const query = new URL(url, 'http://crumbproof.test').searchParams;
        const q = query.get('q')?.toLowerCase();
        const source = query.get('source');
        const found = ingredients
          .filter((i) => !q || [i.name, i.id, i.supplier ?? '', i.supplierCode ?? ''].some((f) => f.toLowerCase().includes(q)))
          .filter((i) => !source || (i.contains ?? []).some((c) => (typeof c === 'string' ? c : c.source) === source));
        const offset = Number(query.get('offset') ?? 0);
        const limit = Number(query.get('limit') ?? found.length);
        return { body: found.slice(offset, offset + limit) };
      },
      'GET /api/specifications/status': { body: SPEC_STATUS },
    }),
  );
}

/** The query strings of the library's reads: the search goes to the API. */
function asked(): string[] {
  return (globalThis.fetch as unknown as { mock: { calls: [RequestInfo | URL][] } }).mock.calls
    .map(([input]) => new URL(requestUrl(input), 'http://crumbproof.test'))
    .filter((url) => url.pathname === '/api/ingredients')
    .map((url) => url.search);
}

function rowNames(): string[] {
  const table = screen.getByRole('table', { name: 'Ingredients in the library' });
  return within(table)
    .getAllByRole('row')
    .slice(1)
    .map((row) => within(row).getAllByRole('cell')[0]?.textContent ?? '');
}

async function openLibrary() {
  const view = renderApp('/ingredients');
  await screen.findByRole('table', { name: 'Ingredients in the library' });
  return view;
}

describe('Ingredient library', () => {
  it('lists every ingredient sorted by name, with contains in bold and unknown statements said in words', async () => {
    api();
    await openLibrary();

    expect(screen.getByRole('heading', { level: 1, name: 'Ingredients' })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'New ingredient' })).toHaveAttribute('href', '/ingredients/new');
    expect(screen.getByRole('link', { name: 'Import from spreadsheet' })).toHaveAttribute('href', '/ingredients/import');
    expect(rowNames()).toEqual(['Caster sugar', 'Chocolate decorations', 'Plain flour', 'Unsalted butter']);

    const table = screen.getByRole('table', { name: 'Ingredients in the library' });
    expect(
      within(table)
        .getAllByRole('columnheader')
        .map((header) => header.textContent?.replace(/[▲▼↕]/g, '')),
    ).toEqual(['Name', 'Contains', 'May contain', 'Vegan', 'Vegetarian', 'Supplier', 'Code', 'Specification', 'Revision', 'Updated']);
    const butter = within(table).getByRole('link', { name: 'Unsalted butter' }).closest('tr') as HTMLElement;
    expect(within(butter).getByText('milk').tagName).toBe('STRONG');
    const decorations = within(table).getByRole('link', { name: 'Chocolate decorations' }).closest('tr') as HTMLElement;
    expect(decorations).toHaveTextContent('Not known');
    const sugar = within(table).getByRole('link', { name: 'Caster sugar' }).closest('tr') as HTMLElement;
    // An empty statement is the supplier's word, never to be read as "not known".
    expect(within(sugar).getAllByText('Supplier states none')).toHaveLength(2);
    expect(within(sugar).queryByText('None recorded')).not.toBeInTheDocument();
    expect(table).toHaveAttribute('aria-rowcount', '5');
  });

  it('narrows the rows by allergen source, counting may-contain apart from contains', async () => {
    api();
    const { user } = await openLibrary();

    await user.selectOptions(screen.getByLabelText('Contains allergen source'), 'wheat');
    await screen.findByText('Showing 1 of 4 ingredients');
    expect(rowNames()).toEqual(['Plain flour']);
    expect(asked()).toContain('?limit=500&offset=0&source=wheat');

    // Flour only may contain soy: it does not contain it.
    await user.selectOptions(screen.getByLabelText('Contains allergen source'), 'soy');
    await waitFor(() => expect(screen.getByText('No ingredient matches these filters.')).toBeInTheDocument());
  });

  it('counts an ingredient with no allergen statement as data missing, but not one whose supplier states none', async () => {
    api();
    const { user } = await openLibrary();

    await user.selectOptions(screen.getByLabelText('Data missing'), 'No allergen statement');
    await waitFor(() => expect(rowNames()).toEqual(['Chocolate decorations']));

    await user.selectOptions(screen.getByLabelText('Data missing'), 'Anything missing');
    // Sugar (none stated) has no specification, so it is missing something; butter and flour have theirs.
    await waitFor(() => expect(rowNames()).toEqual(['Caster sugar', 'Chocolate decorations']));
  });

  it('filters by dietary status and specification', async () => {
    api();
    const { user } = await openLibrary();

    await user.selectOptions(screen.getByLabelText('Dietary status'), 'Vegan: not known');
    await waitFor(() => expect(rowNames()).toEqual(['Chocolate decorations']));
    await user.selectOptions(screen.getByLabelText('Dietary status'), 'Any');

    await user.selectOptions(screen.getByRole('combobox', { name: 'Specification' }), 'Review overdue');
    await waitFor(() => expect(rowNames()).toEqual(['Plain flour']));
    await user.click(screen.getByRole('button', { name: 'Clear filters' }));
    await waitFor(() => expect(rowNames()).toHaveLength(4));
  });

  it('searches with the API once typing pauses, in the name, supplier, supplier code and id', async () => {
    api();
    const { user } = await openLibrary();

    await user.type(screen.getByLabelText('Search ingredients'), 'dale');
    // Waiting on the count, not on the table: reading the table by role again and again starves the page of time.
    await screen.findByText('Showing 1 of 4 ingredients');
    expect(rowNames()).toEqual(['Unsalted butter']);
    // One request for the words as typed once typing paused, none for each keystroke.
    expect(asked().filter((search) => search.includes('q='))).toEqual(['?limit=500&offset=0&q=dale']);
  });

  it('sorts by a column header', async () => {
    api();
    const { user } = await openLibrary();

    await user.click(screen.getByRole('button', { name: /Revision/ }));
    // Revisions 1, 1, 2, 3: the two first revisions come first, in either order.
    await waitFor(() => expect(rowNames().slice(2)).toEqual(['Caster sugar', 'Unsalted butter']));
    expect(screen.getByRole('columnheader', { name: /Revision/ })).toHaveAttribute('aria-sort', 'ascending');
    await user.click(screen.getByRole('button', { name: /Revision/ }));
    await waitFor(() => expect(rowNames()[0]).toBe('Unsalted butter'));
    expect(screen.getByRole('columnheader', { name: /Revision/ })).toHaveAttribute('aria-sort', 'descending');
  });

  it('hides and shows columns from the Columns menu', async () => {
    api();
    const { user } = await openLibrary();
    const table = screen.getByRole('table', { name: 'Ingredients in the library' });

    await user.click(screen.getByRole('button', { name: /Columns/ }));
    const menu = screen.getByRole('group', { name: 'Show columns' });
    expect(within(menu).getByRole('checkbox', { name: 'Name' })).toBeDisabled();

    await user.click(within(menu).getByRole('checkbox', { name: 'Supplier' }));
    expect(within(table).queryByRole('columnheader', { name: /Supplier/ })).not.toBeInTheDocument();
    expect(within(table).queryByText('Dale Dairy')).not.toBeInTheDocument();

    await user.click(within(menu).getByRole('checkbox', { name: 'Supplier code' }));
    expect(within(table).getByRole('columnheader', { name: /Supplier code/ })).toBeInTheDocument();
    expect(within(table).getByText('DD-104')).toBeInTheDocument();

    await user.click(within(menu).getByRole('checkbox', { name: 'Supplier' }));
    expect(within(table).getByText('Dale Dairy')).toBeInTheDocument();

    await user.keyboard('{Escape}');
    expect(screen.getByRole('button', { name: /Columns/ })).toHaveAttribute('aria-expanded', 'false');
  });

  it('still lists the ingredients when the specification status cannot be loaded, without claiming any is missing', async () => {
    mockApi(
      signedInAs('manager', {
        'GET /api/ingredients': { body: INGREDIENTS },
        'GET /api/specifications/status': { status: 503, body: { statusCode: 503, code: 'internal', message: 'Down for a moment.' } },
      }),
    );
    await openLibrary();
    await waitFor(() => expect(screen.getByText('Specification status could not be loaded.')).toBeInTheDocument());
    expect(
      within(screen.getByRole('combobox', { name: 'Specification' }))
        .getAllByRole('option')
        .map((o) => o.textContent),
    ).toEqual(['All']);
    const table = screen.getByRole('table', { name: 'Ingredients in the library' });
    expect(within(table).getAllByText('Not checked')).toHaveLength(4);
    expect(within(table).queryByText('Missing')).not.toBeInTheDocument();
  });

  it('renders only the rows in view of a long list', async () => {
    const many: IngredientView[] = Array.from({ length: 2000 }, (_, index) => ({
      ...INGREDIENTS[0]!,
      id: `ingredient-${String(index).padStart(4, '0')}`,
      name: `Ingredient ${String(index).padStart(4, '0')}`,
    }));
    api(many);
    await openLibrary();
    const table = screen.getByRole('table', { name: 'Ingredients in the library' });
    expect(table).toHaveAttribute('aria-rowcount', '2001');
    const rendered = within(table).getAllByRole('row').length - 1;
    expect(rendered).toBeGreaterThan(5);
    expect(rendered).toBeLessThan(100);
  });
});
