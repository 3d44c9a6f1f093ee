import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { KITCHEN, mockApi, signedInAs } from '@/testing/mock-api';
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

  it('shows the API’s refusal and says nothing was saved', async () => {
    mockApi(
      signedInAs('manager', {
        'PATCH /api/kitchen': {
          status: 400,
          body: {
            statusCode: 400,
            code: 'validation',
            message: 'Some fields need attention.',
            fields: [{ path: 'name', message: 'Give the kitchen a name.' }],
          },
        },
      }),
    );
    const { user } = renderApp('/kitchen');
    await user.click(await screen.findByRole('button', { name: 'Save kitchen settings' }));
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText(/name: Give the kitchen a name/)).toBeInTheDocument();
  });

  it('is refused to a pastry chef', async () => {
    mockApi(signedInAs('pastry-chef'));
    renderApp('/kitchen');
    expect(await screen.findByRole('heading', { level: 1, name: 'Not available to your role' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Save kitchen settings' })).not.toBeInTheDocument();
  });
});
