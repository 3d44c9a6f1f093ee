import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

describe('Not found', () => {
  it('says the page does not exist and links home', async () => {
    mockApi(signedInAs('pastry-chef'));
    const { user, router } = renderApp('/croissants/lamination');

    expect(await screen.findByRole('heading', { level: 1, name: 'Page not found' })).toBeInTheDocument();
    expect(screen.getByText('/croissants/lamination')).toBeInTheDocument();

    await user.click(screen.getByRole('link', { name: 'Go to the home page' }));
    expect(await screen.findByRole('heading', { level: 1, name: 'Ingredients' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/ingredients');
  });
});
