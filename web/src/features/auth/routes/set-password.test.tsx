import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { COMMON_PASSWORD, fieldsRefused, mockApi, signedOut } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

const usable = {
  state: 'usable',
  purpose: 'invitation',
  name: 'Ines Moreau',
  email: 'ines@crumbproof.test',
  expiresAt: '2026-12-05T10:00:00.000Z',
};

describe('Choose your password', () => {
  it('checks the mailed link, sets the password with its token, then points to sign-in', async () => {
    const { calls } = mockApi({
      ...signedOut,
      'POST /api/auth/account-link': { body: usable },
      'POST /api/auth/set-password': { body: { email: 'ines@crumbproof.test' } },
    });
    const { user, router } = renderApp('/set-password#token=mailed-token');

    expect(await screen.findByText('Welcome, Ines Moreau. Your account is ines@crumbproof.test.')).toBeInTheDocument();
    const password = screen.getByLabelText('New password');
    expect(password).toHaveAccessibleDescription(expect.stringContaining('At least 12 characters'));
    await user.type(password, 'short1');
    await user.click(screen.getByRole('button', { name: 'Set my password' }));
    expect(await screen.findByText('Use at least 12 characters.')).toBeInTheDocument();
    expect(calls.some((c) => c.path === '/api/auth/set-password')).toBe(false);

    await user.clear(password);
    await user.type(password, 'tempering-91-chocolate');
    await user.click(screen.getByRole('button', { name: 'Set my password' }));
    expect(await screen.findByText(/Your password is set. Sign in with ines@crumbproof.test/)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Sign in' })).toHaveAttribute('href', '/sign-in');
    expect(calls.find((c) => c.path === '/api/auth/account-link')?.body).toEqual({ token: 'mailed-token' });
    expect(calls.find((c) => c.path === '/api/auth/set-password')?.body).toEqual({
      token: 'mailed-token',
      password: 'tempering-91-chocolate',
    });
    expect(router.state.location.hash).toBe('');
  });

  it('shows the API’s common-password message in place', async () => {
    mockApi({
      ...signedOut,
      'POST /api/auth/account-link': { body: { ...usable, purpose: 'password-reset' } },
      'POST /api/auth/set-password': fieldsRefused({ password: COMMON_PASSWORD }),
    });
    const { user } = renderApp('/set-password#token=mailed-token');
    await user.type(await screen.findByLabelText('New password'), 'Sunshine2024!');
    await user.click(screen.getByRole('button', { name: 'Set my new password' }));
    expect(await screen.findByText(/list of common passwords/)).toBeInTheDocument();
    expect(screen.getByLabelText('New password')).toHaveAttribute('aria-invalid', 'true');
  });

  it.each([
    ['used', 'This link has been used already: each link works once.'],
    ['expired', 'This link has expired.'],
    ['replaced', 'A newer link was sent since this one: open the newest mail.'],
  ] as const)('says in words when the link was %s, and offers a new one', async (state, words) => {
    mockApi({ ...signedOut, 'POST /api/auth/account-link': { body: { state, purpose: 'password-reset' } } });
    renderApp('/set-password#token=old-token');
    expect(await screen.findByText(words)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Send me a new link' })).toHaveAttribute('href', '/forgot-password');
    expect(screen.queryByLabelText('New password')).not.toBeInTheDocument();
  });

  it('says what to do when opened without the link’s token', async () => {
    mockApi(signedOut);
    renderApp('/set-password');
    expect(await screen.findByText('Open the link in the mail you were sent, with its whole address.')).toBeInTheDocument();
  });
});

describe('Forgot your password?', () => {
  it('is reached from sign-in and shows the API’s one answer', async () => {
    const answer =
      'If an account has this email address, a link to choose a new password is on its way to it. The link works once, for 60 minutes.';
    const { calls } = mockApi({ ...signedOut, 'POST /api/auth/password-reset': { status: 202, body: { message: answer } } });
    const { user } = renderApp('/sign-in');
    await user.click(await screen.findByRole('link', { name: 'Forgot your password?' }));
    // The page's code loads on the way; the sign-in page stays until it has.
    await screen.findByRole('heading', { name: 'Forgot your password?' });
    await user.type(screen.getByLabelText('Email'), 'Someone@Crumbproof.test');
    await user.click(screen.getByRole('button', { name: 'Send me a link' }));
    expect(await screen.findByText(answer)).toBeInTheDocument();
    expect(calls.find((c) => c.path === '/api/auth/password-reset')?.body).toEqual({ email: 'someone@crumbproof.test' });
  });
});
