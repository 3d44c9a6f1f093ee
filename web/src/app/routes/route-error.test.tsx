import { render, screen } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { describe, expect, it, vi } from 'vitest';
import { AppProviders } from '../providers';
import { RouteError } from './route-error';

function Broken(): never {
  throw new Error('Recipe “Praline cream” has no lines.');
}

describe('Route error', () => {
  it('shows what happened, the message and a Reload button instead of a blank screen', async () => {
    vi.spyOn(console, 'error').mockImplementation(() => {});
    const router = createMemoryRouter([{ path: '/', element: <Broken />, errorElement: <RouteError /> }]);
    render(
      <AppProviders>
        <RouterProvider router={router} />
      </AppProviders>,
    );

    expect(await screen.findByRole('heading', { level: 1, name: 'Something went wrong on this page' })).toBeInTheDocument();
    expect(screen.getByText('Recipe “Praline cream” has no lines.')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Reload' })).toBeInTheDocument();
  });
});
