import type { ReviewsDue } from '@crumbproof/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

const DUE: ReviewsDue = {
  today: '2026-12-02',
  withinDays: 30,
  overdue: [{ ingredient: 'butter', name: 'Unsalted butter', specification: 4, version: 2, reviewBy: '2026-11-28', daysLeft: -4 }],
  dueSoon: [
    { ingredient: 'walnuts', name: 'Walnut halves', specification: 7, version: 1, reviewBy: '2026-12-02', daysLeft: 0 },
    { ingredient: 'sea-salt', name: 'Sea salt', specification: 9, version: 3, reviewBy: '2026-12-20', daysLeft: 18 },
  ],
};

describe('Today', () => {
  it('lists the specifications overdue for review and those due within 30 days, each linking to its ingredient', async () => {
    mockApi(signedInAs('pastry-chef', { 'GET /api/specifications/reviews-due': { body: DUE } }));
    renderApp('/today');

    expect(await screen.findByRole('heading', { level: 1, name: 'Today' })).toBeInTheDocument();
    const overdue = screen.getByRole('list', { name: 'Specifications overdue for review' });
    expect(within(overdue).getByRole('listitem')).toHaveTextContent(
      'Unsalted butter (specification version 2): review by 28 Nov 2026, 4 days overdue.',
    );
    expect(within(overdue).getByRole('link', { name: 'Unsalted butter' })).toHaveAttribute('href', '/ingredients/butter');
    const soon = screen.getByRole('list', { name: 'Specifications due within 30 days' });
    expect(
      within(soon)
        .getAllByRole('listitem')
        .map((item) => item.textContent),
    ).toEqual([
      'Walnut halves (specification version 1): review by 2 Dec 2026, today.',
      'Sea salt (specification version 3): review by 20 Dec 2026, in 18 days.',
    ]);
    expect(screen.getByText(/Nothing is blocked/)).toBeInTheDocument();
  });

  it('says in words when nothing is due', async () => {
    mockApi(signedInAs('manager', { 'GET /api/specifications/reviews-due': { body: { ...DUE, overdue: [], dueSoon: [] } } }));
    renderApp('/today');
    expect(await screen.findByText('None: no specification is overdue for review.')).toBeInTheDocument();
    expect(screen.getByText('None: no specification is due for review in the next 30 days.')).toBeInTheDocument();
  });

  it('is in the navigation of the manager and the pastry chef, not of front of house, and changes no landing page', async () => {
    mockApi(signedInAs('pastry-chef', { 'GET /api/specifications/reviews-due': { body: DUE } }));
    const { router } = renderApp('/');
    const nav = await screen.findByRole('navigation', { name: /main/i });
    expect(within(nav).getByRole('link', { name: 'Today' })).toHaveAttribute('href', '/today');
    await waitFor(() => expect(router.state.location.pathname).toBe('/ingredients'));
  });
});
