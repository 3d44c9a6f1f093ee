import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

const MESSAGE =
  'Crumbproof cannot reach its database just now, so this could not be done. Try again in a moment; if it keeps happening, the database needs restarting.';
const unavailable = { status: 503, body: { statusCode: 503, code: 'database-unavailable', message: MESSAGE } };

describe('While the server cannot reach its database', () => {
  it('says so in the server’s words instead of asking the person to sign in', async () => {
    mockApi({ 'GET /api/me': unavailable });
    renderApp('/ingredients');

    expect(await screen.findByText(MESSAGE, {}, { timeout: 8000 })).toBeInTheDocument();
    expect(screen.getByText('Crumbproof could not check who is signed in')).toBeInTheDocument();
    expect(screen.queryByRole('heading', { name: 'Sign in' })).not.toBeInTheDocument();
  }, 10_000);

  it('shows the server’s words on a page whose list could not be read', async () => {
    mockApi(signedInAs('pastry-chef', { 'GET /api/ingredients': unavailable }));
    renderApp('/ingredients');

    expect(await screen.findByText(MESSAGE, {}, { timeout: 8000 })).toBeInTheDocument();
  }, 10_000);
});
