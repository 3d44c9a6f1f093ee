import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

const form = () => screen.findByRole('form', { name: 'Public product page' });

describe('Kitchen settings: the public product page (manager)', () => {
  it('is off in a new kitchen; the manager turns it on with the address, shown as a page address while typed', async () => {
    const { calls } = mockApi(
      signedInAs('manager', {
        'PUT /api/public-page/settings': ({ body }) => ({ body: { ...(body as object), updatedAt: '2026-12-02T09:00:00.000Z' } }),
      }),
    );
    const { user } = renderApp('/kitchen');
    const panel = await form();
    const box = within(panel).getByRole('checkbox', { name: 'Turn on the public product page' });
    expect(box).not.toBeChecked();
    await user.click(box);
    await user.type(within(panel).getByLabelText('Address customers reach Crumbproof at'), 'https://menu.larch-street.co.uk/');
    expect(
      within(panel).getByText('A product with the id lemon-tart gets the page https://menu.larch-street.co.uk/p/lemon-tart.'),
    ).toBeInTheDocument();
    await user.click(within(panel).getByRole('button', { name: 'Save public page settings' }));

    expect(await within(panel).findByText(/Saved. Published products have their page/)).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'PUT').map((c) => c.body)).toEqual([
      { enabled: true, baseUrl: 'https://menu.larch-street.co.uk' },
    ]);
  });

  it('refuses to turn it on without an address, or with one that is not http(s), sending nothing', async () => {
    const { calls } = mockApi(signedInAs('manager'));
    const { user } = renderApp('/kitchen');
    const panel = await form();
    await user.click(within(panel).getByRole('checkbox', { name: 'Turn on the public product page' }));
    await user.click(within(panel).getByRole('button', { name: 'Save public page settings' }));
    expect(await within(panel).findByText(/Give the address customers reach Crumbproof at/)).toBeInTheDocument();

    const address = within(panel).getByLabelText('Address customers reach Crumbproof at');
    await user.type(address, 'ftp://menu.example.com');
    await user.click(within(panel).getByRole('button', { name: 'Save public page settings' }));
    expect(await within(panel).findByText('Use an address starting with https:// (or http://).')).toBeInTheDocument();
    expect(address).toHaveAttribute('aria-invalid', 'true');
    expect(calls.some((c) => c.method === 'PUT')).toBe(false);
  });

  it('shows the saved settings, and puts the API’s refusal beside the address', async () => {
    const message = 'Use an address starting with https:// (or http://).';
    mockApi(
      signedInAs('manager', {
        'GET /api/public-page/settings': {
          body: { enabled: true, baseUrl: 'https://menu.example.com', updatedAt: '2026-12-01T09:00:00.000Z' },
        },
        'PUT /api/public-page/settings': {
          status: 400,
          body: { statusCode: 400, code: 'validation', message: `baseUrl: ${message}`, fields: [{ path: 'baseUrl', message }] },
        },
      }),
    );
    const { user } = renderApp('/kitchen');
    const panel = await form();
    await waitFor(() => expect(within(panel).getByRole('checkbox', { name: 'Turn on the public product page' })).toBeChecked());
    expect(within(panel).getByLabelText('Address customers reach Crumbproof at')).toHaveValue('https://menu.example.com');

    await user.click(within(panel).getByRole('checkbox', { name: 'Turn on the public product page' }));
    expect(within(panel).getByText(/Saving turns the page off/)).toBeInTheDocument();
    await user.click(within(panel).getByRole('button', { name: 'Save public page settings' }));
    expect(await within(panel).findByText(message)).toBeInTheDocument();
    expect(within(panel).queryByText(/^Saved/)).not.toBeInTheDocument();
  });
});
