import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { fieldsRefused, KITCHEN, mockApi, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

describe('Kitchen settings (manager)', () => {
  it('shows the kitchen’s regime and handling, and saves a change with PATCH', async () => {
    const { calls } = mockApi(
      signedInAs('manager', {
        'PATCH /api/kitchen': ({ body }) => ({ body: { ...KITCHEN, ...(body as object) } }),
      }),
    );
    const { user } = renderApp('/kitchen');
    expect(await screen.findByRole('heading', { level: 1, name: 'Kitchen' })).toBeInTheDocument();
    expect(await screen.findByLabelText('Declaring regime')).toHaveValue('UK');
    expect(screen.getByLabelText('Allergen source 1')).toHaveValue('sesame');
    expect(screen.getByLabelText('How source 1 is handled')).toHaveValue('shared-equipment');

    await user.click(screen.getByRole('button', { name: 'Add an allergen source' }));
    await user.selectOptions(screen.getByLabelText('Allergen source 2'), 'lupin');
    await user.selectOptions(screen.getByLabelText('How source 2 is handled'), 'segregated');
    await user.selectOptions(screen.getByLabelText('Declaring regime'), 'CA');
    await user.click(screen.getByRole('button', { name: 'Save kitchen settings' }));

    await waitFor(() => expect(calls.some((c) => c.method === 'PATCH')).toBe(true));
    expect(calls.find((c) => c.method === 'PATCH')?.body).toEqual({
      name: KITCHEN.name,
      address: KITCHEN.address,
      regime: 'CA',
      measures: null,
      handles: [
        { allergen: 'sesame', controls: 'shared-equipment' },
        { allergen: 'lupin', controls: 'segregated' },
      ],
    });
    expect(await screen.findByText(/Every product’s declaration now follows these settings/)).toBeInTheDocument();
  });

  it('places the API’s refusal beside the field it names, and says nothing was saved', async () => {
    mockApi(
      signedInAs('manager', {
        'PATCH /api/kitchen': fieldsRefused({ name: 'Give the kitchen a name.' }),
      }),
    );
    const { user } = renderApp('/kitchen');
    await user.click(await screen.findByRole('button', { name: 'Save kitchen settings' }));
    const name = await screen.findByLabelText('Kitchen name');
    await waitFor(() => expect(name).toHaveAttribute('aria-invalid', 'true'));
    expect(name).toHaveAccessibleDescription(/Give the kitchen a name/);
    expect(screen.queryByText(/name: Give the kitchen a name/)).not.toBeInTheDocument();
    expect(await screen.findByText('Nothing was saved. Check the fields marked above.')).toBeInTheDocument();
  });

  it('places its own check beside the field before sending anything', async () => {
    const { calls } = mockApi(signedInAs('manager'));
    const { user } = renderApp('/kitchen');
    const name = await screen.findByLabelText('Kitchen name');
    await user.clear(name);
    await user.click(screen.getByRole('button', { name: 'Save kitchen settings' }));
    await waitFor(() => expect(name).toHaveAccessibleDescription(/Give the kitchen a name/));
    expect(calls.some((c) => c.method === 'PATCH')).toBe(false);
  });

  it('says a refusal that names no field above the button', async () => {
    mockApi(
      signedInAs('manager', {
        'PATCH /api/kitchen': {
          status: 409,
          body: { statusCode: 409, code: 'conflict', message: 'The kitchen was changed by someone else.', fields: [] },
        },
      }),
    );
    const { user } = renderApp('/kitchen');
    await user.click(await screen.findByRole('button', { name: 'Save kitchen settings' }));
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText(/changed by someone else/)).toBeInTheDocument();
  });

  it('is refused to a pastry chef', async () => {
    mockApi(signedInAs('pastry-chef'));
    renderApp('/kitchen');
    expect(await screen.findByRole('heading', { level: 1, name: 'Not available to your role' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Save kitchen settings' })).not.toBeInTheDocument();
  });

  it('says what the kitchen makes differently: its own ingredient in place of the book’s, and what it sells', async () => {
    mockApi(
      signedInAs('manager', {
        'GET /api/book/kitchen': {
          body: {
            code: 'saltmarsh-yard',
            name: 'Saltmarsh Yard Café',
            substitutions: [
              {
                replaces: { id: 'plain-flour', name: 'Plain wheat flour' },
                with: { id: 'marsh-mill-flour', name: 'Stoneground wheat flour', supplier: 'Marsh Mill' },
                note: 'Milled down the lane.',
                lines: 3,
              },
            ],
            sells: [{ id: 'griddle-pancakes', name: 'Griddle pancakes' }],
            notSold: [{ id: 'layer-cake', name: 'Layer cake' }],
          },
        },
      }),
    );
    renderApp('/kitchen');
    const panel = await screen.findByRole('region', { name: 'Made differently here' });
    expect(await within(panel).findByRole('list', { name: 'Stand-ins at this kitchen' })).toHaveTextContent(
      'Stoneground wheat flour (Marsh Mill) in place of Plain wheat flour, on 3 recipe lines. Milled down the lane.',
    );
    expect(within(panel).getByText('1 of the book’s 2 products for sale: Griddle pancakes.')).toBeInTheDocument();
    expect(within(panel).getByText('Not sold here: Layer cake.')).toBeInTheDocument();
  });

  it('says when the kitchen makes everything as the book does', async () => {
    mockApi(
      signedInAs('manager', {
        'GET /api/book/kitchen': { body: { code: null, name: KITCHEN.name, substitutions: [], sells: null, notSold: [] } },
      }),
    );
    renderApp('/kitchen');
    const panel = await screen.findByRole('region', { name: 'Made differently here' });
    expect(await within(panel).findByText(/None: every recipe line here uses the book’s shared ingredient/)).toBeInTheDocument();
    expect(within(panel).getByText('Every product for sale in the recipe book.')).toBeInTheDocument();
  });
});
