import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { COMMON_PASSWORD, fieldsRefused, mockApi, signedOut } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

describe('Set the first manager', () => {
  it('sends the link’s token with the new manager, then points to sign-in', async () => {
    const { calls } = mockApi({
      ...signedOut,
      'POST /api/auth/first-manager': {
        status: 201,
        body: { id: 1, email: 'owner@crumbproof.test', name: 'Ada Rowe', role: 'manager', kitchen: null, kitchens: [] },
      },
    });
    const { user, router } = renderApp('/first-manager#token=one-time-token');

    await user.type(await screen.findByLabelText('Your name'), 'Ada Rowe');
    await user.type(screen.getByLabelText('Email'), 'owner@crumbproof.test');
    await user.type(screen.getByLabelText('Password'), 'rye-sourdough-starter-9');
    await user.click(screen.getByRole('button', { name: 'Set the first manager' }));

    expect(await screen.findByText(/Ada Rowe is the kitchen’s manager/)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Sign in' })).toHaveAttribute('href', '/sign-in');
    expect(calls.find((c) => c.path === '/api/auth/first-manager')?.body).toEqual({
      token: 'one-time-token',
      name: 'Ada Rowe',
      email: 'owner@crumbproof.test',
      password: 'rye-sourdough-starter-9',
    });
    expect(router.state.location.hash).toBe('');
  });

  it('shows the API’s field message for a common password, in place', async () => {
    mockApi({
      ...signedOut,
      'POST /api/auth/first-manager': fieldsRefused({ password: COMMON_PASSWORD }),
    });
    const { user } = renderApp('/first-manager#token=one-time-token');
    await user.type(await screen.findByLabelText('Your name'), 'Ada Rowe');
    await user.type(screen.getByLabelText('Email'), 'owner@crumbproof.test');
    await user.type(screen.getByLabelText('Password'), 'Sunshine2024!');
    await user.click(screen.getByRole('button', { name: 'Set the first manager' }));
    expect(await screen.findByText(/list of common passwords/)).toBeInTheDocument();
  });

  it('says what to do when opened without the link’s token', async () => {
    mockApi(signedOut);
    renderApp('/first-manager');
    expect(await screen.findByText(/Open the one-time link that Crumbproof printed/)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Set the first manager' })).not.toBeInTheDocument();
  });
});
