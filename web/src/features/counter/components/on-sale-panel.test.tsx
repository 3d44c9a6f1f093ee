import type { CounterDayView, Role } from '@crumbproof/shared';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { queryKeys } from '@/api/query-keys';
import type { ApiHandlers } from '@/testing/mock-api';
import { renderAs } from '../testing/render-as';
import { OnSalePanel } from './on-sale-panel';

const TODAY = '2026-12-02';

/** Only what the panel reads of each product; the declarations are not its business. */
const PRODUCTS = [
  { id: 'walnut-loaf', name: 'Walnut loaf' },
  { id: 'lemon-tart', name: 'Lemon tart' },
  { id: 'seeded-bun', name: 'Seeded bun' },
  { id: 'lemon-drizzle', name: 'Lemon drizzle slice' },
];

const VIEW = { date: TODAY, products: PRODUCTS };

const MARKED_TODAY: CounterDayView = {
  date: TODAY,
  products: ['lemon-tart', 'seeded-bun'],
  setBy: 'Teodor Lind',
  setAt: '2026-12-02T07:10:00.000Z',
};

function dayRoute(days: Record<string, CounterDayView>): ApiHandlers[string] {
  return ({ url }) => {
    const date = new URL(url, 'http://crumbproof.test').searchParams.get('date') ?? TODAY;
    return { body: days[date] ?? { date, products: [], setBy: null, setAt: null } };
  };
}

function renderPanel(role: Role, handlers: ApiHandlers) {
  return renderAs(role, handlers, <OnSalePanel view={VIEW} />);
}

const box = (name: string) => screen.getByRole('checkbox', { name });

describe('OnSalePanel', () => {
  it('shows the pastry chef today’s products ticked as marked, with who marked them', async () => {
    const { calls } = renderPanel('pastry-chef', { 'GET /api/counter/today': dayRoute({ [TODAY]: MARKED_TODAY }) });

    expect(await screen.findByText('2 of 4 products ticked for today')).toBeInTheDocument();
    expect(screen.getByText(/Marked by Teodor Lind, 2 Dec 2026/)).toBeInTheDocument();
    // Alphabetical, as on the counter.
    expect(screen.getAllByRole('checkbox').map((c) => c.closest('label')?.textContent)).toEqual([
      'Lemon drizzle slice',
      'Lemon tart',
      'Seeded bun',
      'Walnut loaf',
    ]);
    expect(box('Lemon tart')).toBeChecked();
    expect(box('Seeded bun')).toBeChecked();
    expect(box('Walnut loaf')).not.toBeChecked();
    expect(calls.find((c) => c.path === '/api/counter/today')?.method).toBe('GET');
  });

  it('narrows by search, selects all shown, unticks one and saves the day in one request', async () => {
    let saved = MARKED_TODAY;
    const { calls, user, queryClient } = renderPanel('manager', {
      'GET /api/counter/today': () => ({ body: saved }),
      'PUT /api/counter/today': ({ body }) => {
        saved = { ...(body as { date: string; products: string[] }), setBy: 'Maren Okafor', setAt: '2026-12-02T08:00:00.000Z' };
        return { body: saved };
      },
    });
    queryClient.setQueryData(queryKeys.counter.products(), { ...VIEW, computedAt: '2026-12-02T07:00:00.000Z' });

    await screen.findByText('2 of 4 products ticked for today');
    await user.type(screen.getByLabelText('Find a product'), 'lemon');
    expect(screen.getAllByRole('checkbox')).toHaveLength(2);
    await user.click(screen.getByRole('button', { name: 'Select all shown' }));
    expect(box('Lemon drizzle slice')).toBeChecked();
    await user.clear(screen.getByLabelText('Find a product'));
    await user.click(box('Seeded bun'));
    await user.click(box('Walnut loaf'));
    expect(screen.getByText('3 of 4 products ticked for today')).toBeInTheDocument();
    expect(screen.getByText('Not saved yet.')).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Save today’s products' }));

    expect(await screen.findByText('Saved: 3 products on sale today.')).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'PUT').map((c) => c.body)).toEqual([
      { date: TODAY, products: ['lemon-drizzle', 'lemon-tart', 'walnut-loaf'] },
    ]);
    expect(screen.getByText(/Marked by Maren Okafor/)).toBeInTheDocument();
    // The counter's products (each with "on sale today") are read again.
    expect(queryClient.getQueryState(queryKeys.counter.products())?.isInvalidated).toBe(true);
  });

  it('selects none and saves an empty day', async () => {
    const { calls, user } = renderPanel('pastry-chef', {
      'GET /api/counter/today': dayRoute({ [TODAY]: MARKED_TODAY }),
      'PUT /api/counter/today': ({ body }) => ({ body: { ...(body as object), setBy: 'Teodor Lind', setAt: '2026-12-02T08:00:00.000Z' } }),
    });
    await screen.findByText('2 of 4 products ticked for today');
    await user.click(screen.getByRole('button', { name: 'Select none' }));
    expect(screen.getByText('0 of 4 products ticked for today')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Save today’s products' }));
    expect(await screen.findByText('Saved: 0 products on sale today.')).toBeInTheDocument();
    expect(calls.find((c) => c.method === 'PUT')?.body).toEqual({ date: TODAY, products: [] });
  });

  it('names the product the API refuses and keeps the ticks', async () => {
    const message = "'seeded-bun' is not for sale: it is an intermediate recipe.";
    const { user } = renderPanel('pastry-chef', {
      'GET /api/counter/today': dayRoute({ [TODAY]: MARKED_TODAY }),
      'PUT /api/counter/today': {
        status: 400,
        body: { statusCode: 400, code: 'validation', message: `products.1: ${message}`, fields: [{ path: 'products.1', message }] },
      },
    });
    await screen.findByText('2 of 4 products ticked for today');
    await user.click(box('Walnut loaf'));
    await user.click(screen.getByRole('button', { name: 'Save today’s products' }));

    expect(await screen.findByRole('alert')).toHaveTextContent(`Seeded bun: ${message}`);
    expect(box('Walnut loaf')).toBeChecked();
    expect(screen.getByText('Not saved yet.')).toBeInTheDocument();
  });

  it('shows front of house today’s list to read, with no ticks', async () => {
    renderPanel('front-of-house', { 'GET /api/counter/today': dayRoute({ [TODAY]: MARKED_TODAY }) });

    const list = await screen.findByRole('list', { name: 'On sale today' });
    expect(
      within(list)
        .getAllByRole('listitem')
        .map((li) => li.textContent),
    ).toEqual(['Lemon tart', 'Seeded bun']);
    expect(screen.getByText('2 products on sale today')).toBeInTheDocument();
    expect(screen.getByText(/Marked by Teodor Lind/)).toBeInTheDocument();
    expect(screen.queryByRole('checkbox')).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Save/ })).not.toBeInTheDocument();
  });

  it('looks up a past day read only, even for the kitchen, and says when nothing was marked', async () => {
    const past: CounterDayView = {
      date: '2026-11-28',
      products: ['walnut-loaf', 'plum-galette'],
      setBy: 'Maren Okafor',
      setAt: '2026-11-28T06:55:00.000Z',
    };
    const { calls } = renderPanel('manager', { 'GET /api/counter/today': dayRoute({ [TODAY]: MARKED_TODAY, '2026-11-28': past }) });
    await screen.findByText('2 of 4 products ticked for today');

    fireEvent.change(screen.getByLabelText('Day'), { target: { value: '2026-11-28' } });
    const list = await screen.findByRole('list', { name: 'On sale on 28 Nov 2026' });
    // A product no longer for sale is still named by its id.
    expect(
      within(list)
        .getAllByRole('listitem')
        .map((li) => li.textContent),
    ).toEqual(['plum-galette (no longer for sale)', 'Walnut loaf']);
    expect(screen.getByText(/Marked by Maren Okafor, 28 Nov 2026/)).toBeInTheDocument();
    expect(screen.queryByRole('checkbox')).not.toBeInTheDocument();

    fireEvent.change(screen.getByLabelText('Day'), { target: { value: '2026-11-27' } });
    expect(await screen.findByText('Nothing was marked on sale on 27 Nov 2026.')).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'GET').map((c) => new URL(c.path, 'http://x').pathname)).toHaveLength(3);
  });

  it('asks for a day when the date box is cleared, and reads nothing', async () => {
    const { calls } = renderPanel('manager', { 'GET /api/counter/today': dayRoute({ [TODAY]: MARKED_TODAY }) });
    await screen.findByText('2 of 4 products ticked for today');
    fireEvent.change(screen.getByLabelText('Day'), { target: { value: '' } });
    expect(await screen.findByText('Pick a day.')).toBeInTheDocument();
    expect(screen.queryByRole('checkbox')).not.toBeInTheDocument();
    await waitFor(() => expect(calls.filter((c) => c.method === 'GET')).toHaveLength(1));
  });

  it('warns when the day is marked again by someone else while ticks are unsaved', async () => {
    const { user, queryClient } = renderPanel('pastry-chef', { 'GET /api/counter/today': dayRoute({ [TODAY]: MARKED_TODAY }) });
    await screen.findByText('2 of 4 products ticked for today');
    await user.click(box('Walnut loaf'));

    queryClient.setQueryData(queryKeys.counter.day(TODAY), {
      ...MARKED_TODAY,
      products: ['lemon-tart'],
      setBy: 'Maren Okafor',
      setAt: '2026-12-02T07:30:00.000Z',
    });
    expect(await screen.findByRole('alert')).toHaveTextContent(/Maren Okafor saved this day at .*Saving now replaces their list/);
    // The person's own ticks stay as they were.
    expect(box('Walnut loaf')).toBeChecked();
    expect(box('Seeded bun')).toBeChecked();
  });
});
