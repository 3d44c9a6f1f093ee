import type { CounterProductsView } from '@crumbproof/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { queryKeys } from '@/api/query-keys';
import { demoCounterView } from '@/features/counter/testing/counter-view';
import { FakeEventSource, stubEventSource } from '@/features/counter/testing/fake-event-source';
import { inesAt, KITCHEN, mockApi, SALTMARSH, signedInAs, type ApiHandlers, type MockResponse } from '@/testing/mock-api';
import { BUTTER } from '@/features/ingredients/testing/fixtures';
import { LEAVE_QUESTION } from '@/lib/unsaved-changes';
import { renderApp } from '@/testing/render-app';

const STORED = 'crumbproof.kitchen.4';
const CAKE = 'Strawberry and vanilla layer cake';
const TART = 'Saltmarsh sea-buckthorn tart';

const LARCH_COUNTER = demoCounterView();
/** Saltmarsh Yard declares under EU rules and sells a product of its own. */
const SALTMARSH_COUNTER: CounterProductsView = {
  ...LARCH_COUNTER,
  regime: 'EU',
  products: [{ ...LARCH_COUNTER.products[0]!, id: 'sea-buckthorn-tart', name: TART }],
};

/** The pages the main navigation offers. */
function menu(): (string | null)[] {
  return within(screen.getByRole('navigation', { name: 'Main' }))
    .getAllByRole('link')
    .map((link) => link.textContent);
}

/** The API as Ines (manager at Larch Street, front of house at Saltmarsh Yard) meets it: every answer for the kitchen named. */
function inesApi(extra: ApiHandlers = {}) {
  return mockApi({
    ...signedInAs('manager'),
    'GET /api/me': ({ kitchen }) => ({ body: inesAt(kitchen) }),
    'GET /api/kitchen': ({ kitchen }) => ({ body: kitchen === '2' ? SALTMARSH : KITCHEN }),
    'GET /api/counter/products': ({ kitchen }) => ({ body: kitchen === '2' ? SALTMARSH_COUNTER : LARCH_COUNTER }),
    'GET /api/counter/questions': { body: [] },
    'GET /api/ingredients': { body: [] },
    ...extra,
  });
}

describe('Which kitchen the app works in', () => {
  beforeEach(() => stubEventSource());

  it('asks someone of two kitchens which one, before reading anything of either', async () => {
    const { calls } = inesApi();
    const { user } = renderApp('/');

    expect(await screen.findByRole('heading', { level: 1, name: 'Which kitchen are you working in?' })).toBeInTheDocument();
    const choices = within(screen.getByRole('list', { name: 'Your kitchens' })).getAllByRole('button');
    expect(choices.map((button) => button.textContent)).toEqual([
      'Larch Street Bakehouse Your role here: Manager',
      'Saltmarsh Yard Café Your role here: Front of house',
    ]);
    expect(screen.queryByRole('navigation', { name: 'Main' })).not.toBeInTheDocument();
    expect(calls.map((call) => `${call.path} ${call.kitchen}`)).toEqual(['/api/me null']);

    await user.click(screen.getByRole('button', { name: /Saltmarsh Yard Café/ }));

    // Front of house there: the counter is their first page, and the menu is theirs at Saltmarsh Yard.
    expect(await screen.findByRole('heading', { level: 1, name: 'Counter' })).toBeInTheDocument();
    expect(menu()).toEqual(['Counter', 'Recipes']);
    expect(window.localStorage.getItem(STORED)).toBe('2');
    const after = calls.slice(1);
    expect(after.map((call) => call.path)).toContain('/api/me');
    expect(after.every((call) => call.kitchen === '2')).toBe(true);
  });

  it('does not ask someone of one kitchen, and names it on every request', async () => {
    const { calls } = mockApi(signedInAs('pastry-chef', { 'GET /api/ingredients': { body: [] } }));
    renderApp('/');

    expect(await screen.findByRole('heading', { level: 1, name: 'Ingredients' })).toBeInTheDocument();
    expect(screen.queryByRole('heading', { name: 'Which kitchen are you working in?' })).not.toBeInTheDocument();
    const banner = screen.getByRole('banner');
    expect(within(banner).getByText(/Working in/)).toHaveTextContent('Working in Larch Street Bakehouse');
    // One kitchen: nothing to switch to.
    expect(within(banner).queryByRole('combobox')).not.toBeInTheDocument();
    const [first, ...rest] = calls;
    expect(first).toMatchObject({ path: '/api/me', kitchen: null });
    expect(rest.length).toBeGreaterThan(0);
    expect(rest.every((call) => call.kitchen === '1')).toBe(true);
  });

  it('sends the kitchen chosen last in this browser, in the header and in the stream’s address', async () => {
    window.localStorage.setItem(STORED, '2');
    const { calls } = inesApi();
    renderApp('/counter');

    expect(await screen.findByRole('heading', { level: 1, name: 'Counter' })).toBeInTheDocument();
    expect(await screen.findByText('Declared for Saltmarsh Yard Café (EU rules)')).toBeInTheDocument();
    expect(screen.queryByRole('heading', { name: 'Which kitchen are you working in?' })).not.toBeInTheDocument();
    const products = calls.filter((call) => call.path === '/api/counter/products');
    expect(products.map((call) => call.kitchen)).toEqual(['2']);
    expect(calls.filter((call) => call.path !== '/api/me' || call.kitchen !== null).every((call) => call.kitchen === '2')).toBe(true);
    expect(new URL(FakeEventSource.current().url, 'http://crumbproof.test').searchParams.get('kitchen')).toBe('2');
  });

  it('asks again when the kitchen chosen last is no longer one of theirs', async () => {
    window.localStorage.setItem(STORED, '9');
    inesApi();
    renderApp('/');

    expect(await screen.findByRole('heading', { level: 1, name: 'Which kitchen are you working in?' })).toBeInTheDocument();
  });

  it('stops naming a kitchen that refuses them, and works in the one they still have', async () => {
    window.localStorage.setItem(STORED, '2');
    const refused: MockResponse = {
      status: 403,
      body: { statusCode: 403, code: 'forbidden', message: 'You have no role in this kitchen.' },
    };
    const { calls } = inesApi({
      'GET /api/me': ({ kitchen }) => (kitchen === '2' ? refused : { body: { ...inesAt(kitchen), kitchens: [inesAt(null).kitchens[0]!] } }),
    });
    renderApp('/');

    expect(await screen.findByRole('heading', { level: 1, name: 'Ingredients' })).toBeInTheDocument();
    expect(within(screen.getByRole('banner')).getByText(/Working in/)).toHaveTextContent('Working in Larch Street Bakehouse');
    expect(calls.at(-1)?.kitchen).toBe('1');
  });
});

describe('Switching kitchen', () => {
  beforeEach(() => stubEventSource());

  it('drops what was read for the other kitchen at once, reads who they are there, and sends the new kitchen', async () => {
    window.localStorage.setItem(STORED, '1');
    let release: (answer: MockResponse) => void = () => {};
    const held = new Promise<MockResponse>((resolve) => (release = resolve));
    const { calls } = inesApi({
      'GET /api/counter/products': ({ kitchen }) => (kitchen === '2' ? held : { body: LARCH_COUNTER }),
    });
    const { user, queryClient } = renderApp('/counter');

    expect(await screen.findByText('Declared for Larch Street Bakehouse (UK rules)')).toBeInTheDocument();
    expect(await screen.findByRole('button', { name: new RegExp(`^${CAKE}`) })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Print the allergen chart' })).toBeInTheDocument();
    const firstStream = FakeEventSource.current();
    const before = calls.length;

    const switcher = within(screen.getByRole('banner')).getByRole('combobox', { name: 'Working in' });
    expect(switcher).toHaveDisplayValue('Larch Street Bakehouse (Manager)');
    await user.selectOptions(switcher, 'Saltmarsh Yard Café (Front of house)');

    // Nothing of Larch Street is on screen or in the cache while Saltmarsh Yard's products are on their way.
    expect(screen.queryByText(CAKE)).not.toBeInTheDocument();
    expect(screen.queryByText('Declared for Larch Street Bakehouse (UK rules)')).not.toBeInTheDocument();
    expect(queryClient.getQueryData(queryKeys.counter.products())).toBeUndefined();
    expect(await screen.findByText('Reading every product’s declaration…')).toBeInTheDocument();
    expect(screen.queryByText(CAKE)).not.toBeInTheDocument();

    release({ body: SALTMARSH_COUNTER });
    expect(await screen.findByRole('button', { name: new RegExp(`^${TART}`) })).toBeInTheDocument();
    expect(screen.getByText('Declared for Saltmarsh Yard Café (EU rules)')).toBeInTheDocument();
    expect(screen.queryByText(CAKE)).not.toBeInTheDocument();

    // Who they are there: front of house, so no chart to print and the front-of-house menu.
    expect(screen.queryByRole('link', { name: 'Print the allergen chart' })).not.toBeInTheDocument();
    expect(menu()).toEqual(['Counter', 'Recipes']);
    expect(within(screen.getByRole('banner')).getByRole('combobox', { name: 'Working in' })).toHaveDisplayValue(
      'Saltmarsh Yard Café (Front of house)',
    );

    const after = calls.slice(before);
    expect(after.map((call) => call.path)).toEqual(expect.arrayContaining(['/api/me', '/api/counter/products']));
    expect(after.every((call) => call.kitchen === '2')).toBe(true);
    expect(window.localStorage.getItem(STORED)).toBe('2');
    expect(firstStream.readyState).toBe(FakeEventSource.CLOSED);
    expect(new URL(FakeEventSource.current().url, 'http://crumbproof.test').searchParams.get('kitchen')).toBe('2');
  });

  it('opens their first page there when their role there cannot open the page they were on', async () => {
    window.localStorage.setItem(STORED, '1');
    inesApi({ 'GET /api/users': { body: [] } });
    const { user, router } = renderApp('/users');

    expect(await screen.findByRole('heading', { level: 1, name: 'Users' })).toBeInTheDocument();
    await user.selectOptions(
      within(screen.getByRole('banner')).getByRole('combobox', { name: 'Working in' }),
      'Saltmarsh Yard Café (Front of house)',
    );

    expect(await screen.findByRole('heading', { level: 1, name: 'Counter' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/counter');
    await waitFor(() => expect(screen.queryByRole('heading', { name: 'Not available to your role' })).not.toBeInTheDocument());
  });

  it('asks before an editor’s unsaved changes are dropped, by another kitchen or another page, and keeps them when told to', async () => {
    window.localStorage.setItem(STORED, '1');
    const confirm = vi.spyOn(window, 'confirm').mockReturnValue(false);
    try {
      inesApi({
        'GET /api/ingredients/butter': { body: BUTTER },
        'GET /api/ingredients/butter/used-in': { body: [] },
        'GET /api/ingredients/butter/specifications': { body: [] },
        'GET /api/ingredients/butter/revisions': { body: [] },
      });
      const { user } = renderApp('/ingredients/butter');
      const supplier = await screen.findByLabelText('Supplier');
      await user.clear(supplier);
      await user.type(supplier, 'Marram Dairy');

      await user.selectOptions(screen.getByLabelText('Working in'), '2');
      expect(confirm).toHaveBeenLastCalledWith(LEAVE_QUESTION);
      expect(screen.getByLabelText('Working in')).toHaveValue('1');
      expect(screen.getByLabelText('Supplier')).toHaveValue('Marram Dairy');

      await user.click(within(screen.getByRole('navigation', { name: 'Main' })).getByRole('link', { name: 'Ingredients' }));
      expect(confirm).toHaveBeenCalledTimes(2);
      expect(screen.getByLabelText('Supplier')).toHaveValue('Marram Dairy');

      confirm.mockReturnValue(true);
      await user.selectOptions(screen.getByLabelText('Working in'), '2');
      expect(await screen.findByText('Declared for Saltmarsh Yard Café (EU rules)')).toBeInTheDocument();
      expect(confirm).toHaveBeenCalledTimes(3);
    } finally {
      confirm.mockRestore();
    }
  });
});
