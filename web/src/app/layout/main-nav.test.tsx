import type { Role } from '@crumbproof/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, PEOPLE, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

const cases: { role: Role; links: string[]; first: string }[] = [
  {
    role: 'manager',
    links: ['Ingredients', 'Today', 'Recipes', 'Counter', 'Labels', 'Approvals', 'Audit', 'Kitchen', 'Users', 'Mail'],
    first: 'Ingredients',
  },
  { role: 'pastry-chef', links: ['Ingredients', 'Today', 'Recipes', 'Counter', 'Labels', 'Approvals'], first: 'Ingredients' },
  { role: 'front-of-house', links: ['Counter', 'Recipes'], first: 'Counter' },
];

describe('Main navigation', () => {
  it.each(cases)('shows $role exactly their pages and opens $first first', async ({ role, links, first }) => {
    mockApi(signedInAs(role, { 'GET /api/users': { body: [] } }));
    renderApp('/');

    expect(await screen.findByRole('heading', { level: 1, name: first })).toBeInTheDocument();
    const nav = screen.getByRole('navigation', { name: 'Main' });
    const names = within(nav)
      .getAllByRole('link')
      .map((link) => link.textContent);
    expect(names).toEqual(links);
    expect(within(nav).getByRole('link', { name: first })).toHaveAttribute('aria-current', 'page');
  });

  it('moves between pages', async () => {
    mockApi(signedInAs('front-of-house', { 'GET /api/recipes': { body: [] }, 'GET /api/declarations': { body: [] } }));
    const { user } = renderApp('/counter');

    const nav = await screen.findByRole('navigation', { name: 'Main' });
    await user.click(within(nav).getByRole('link', { name: 'Recipes' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Recipes' })).toBeInTheDocument();
    expect(screen.getByRole('main')).toHaveFocus();
    expect(await screen.findByRole('table', { name: 'Recipes and products' })).toBeInTheDocument();
    expect(screen.getAllByRole('heading', { level: 1 })).toHaveLength(1);
  });

  it('keeps the page working, and names the kitchen from who is signed in, when the kitchen cannot be fetched', async () => {
    mockApi(
      signedInAs('pastry-chef', {
        'GET /api/kitchen': { status: 500, body: { statusCode: 500, code: 'internal', message: 'Down.' } },
      }),
    );
    renderApp('/labels');

    expect(await screen.findByRole('heading', { level: 1, name: 'Labels' })).toBeInTheDocument();
    const banner = screen.getByRole('banner');
    expect(within(banner).getByText('Teodor Lind')).toBeInTheDocument();
    expect(within(banner).getByText('Larch Street Bakehouse')).toBeInTheDocument();
  });

  it('goes without the kitchen’s name on an installation with no kitchen set up whose settings cannot be read', async () => {
    mockApi(
      signedInAs('manager', {
        'GET /api/me': { body: { ...PEOPLE.manager, kitchen: null, kitchens: [] } },
        'GET /api/kitchen': { status: 500, body: { statusCode: 500, code: 'internal', message: 'Down.' } },
      }),
    );
    renderApp('/audit');

    expect(await screen.findByRole('heading', { level: 1, name: 'Audit' })).toBeInTheDocument();
    expect(within(screen.getByRole('banner')).queryByText(/Working in/)).not.toBeInTheDocument();
  });

  it('gives every page a skip link, a main landmark and the caution', async () => {
    mockApi(signedInAs('manager'));
    renderApp('/audit');

    expect(await screen.findByRole('heading', { level: 1, name: 'Audit' })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Skip to main content' })).toHaveAttribute('href', '#main');
    expect(screen.getByRole('main')).toHaveAttribute('id', 'main');
    expect(screen.getByRole('contentinfo')).toHaveTextContent(
      'Crumbproof computes declarations from the recipes and supplier information entered.',
    );
  });
});

describe('Main navigation after a change of access', () => {
  const refused = { status: 403, body: { statusCode: 403, code: 'forbidden', message: 'This needs the manager or pastry chef role.' } };

  it('follows a role changed while the page is open at the next refused request, without a reload', async () => {
    let role: Role = 'pastry-chef';
    mockApi({
      ...signedInAs('pastry-chef', { 'GET /api/recipes': { body: [] }, 'GET /api/declarations': { body: [] } }),
      'GET /api/me': () => ({ body: PEOPLE[role] }),
      'GET /api/ingredients': () => (role === 'pastry-chef' ? { body: [] } : refused),
    });
    const { user } = renderApp('/recipes');
    const nav = await screen.findByRole('navigation', { name: 'Main' });
    expect(within(nav).getByRole('link', { name: 'Ingredients' })).toBeInTheDocument();

    role = 'front-of-house';
    await user.click(within(nav).getByRole('link', { name: 'Ingredients' }));
    await waitFor(() => expect(within(nav).queryByRole('link', { name: 'Ingredients' })).not.toBeInTheDocument());
    expect(
      within(nav)
        .getAllByRole('link')
        .map((link) => link.textContent),
    ).toEqual(['Counter', 'Recipes']);
  });

  it('opens sign-in at the next request once the person’s sessions were ended', async () => {
    let ended = false;
    const gone = { status: 401, body: { statusCode: 401, code: 'unauthenticated', message: 'Sign in first.' } };
    mockApi({
      ...signedInAs('pastry-chef', { 'GET /api/recipes': { body: [] }, 'GET /api/declarations': { body: [] } }),
      'GET /api/me': () => (ended ? gone : { body: PEOPLE['pastry-chef'] }),
      'GET /api/ingredients': () => (ended ? gone : { body: [] }),
    });
    const { user } = renderApp('/recipes');
    const nav = await screen.findByRole('navigation', { name: 'Main' });
    ended = true;
    await user.click(within(nav).getByRole('link', { name: 'Ingredients' }));
    expect(await screen.findByRole('heading', { level: 1, name: /Sign in/ })).toBeInTheDocument();
  });
});
