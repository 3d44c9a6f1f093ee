import type { CounterProductsView, CounterQuestionView } from '@crumbproof/shared';
import { act, screen, waitFor, within } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';
import { mockApi, signedInAs, type ApiHandlers } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';
import { FakeEventSource, stubEventSource } from '../testing/fake-event-source';
import { demoCounterView } from '../testing/counter-view';

const CAKE = 'Strawberry and vanilla layer cake';
const BROWNIE = 'Dark chocolate brownie (vegan)';

function question(overrides: Partial<CounterQuestionView> = {}): CounterQuestionView {
  return {
    id: 7,
    product: 'vegan-brownie',
    productName: BROWNIE,
    avoid: ['eggs', 'sesame'],
    note: null,
    askedBy: 'Priya Sandhu',
    askedAt: '2026-12-02T08:31:00.000Z',
    answer: null,
    ...overrides,
  };
}

function counterApi(role: 'front-of-house' | 'pastry-chef', views: CounterProductsView[], extra: ApiHandlers = {}) {
  let reads = 0;
  return mockApi(
    signedInAs(role, {
      'GET /api/counter/products': () => ({ body: views[Math.min(reads++, views.length - 1)] }),
      'GET /api/counter/questions': { body: [] },
      ...extra,
    }),
  );
}

/** The results row of a product (a button naming it). */
const row = (name: string) => screen.getByRole('button', { name: new RegExp(`^${name.replace(/[()]/g, '\\$&')}`) });

describe('the counter’s look up', () => {
  beforeEach(() => stubEventSource());

  it('says in its header which kitchen’s counter it is, and listens to that kitchen’s events', async () => {
    counterApi('front-of-house', [demoCounterView()]);
    renderApp('/counter');

    const heading = await screen.findByRole('heading', { name: 'Counter', level: 1 });
    const header = heading.parentElement!;
    expect(await within(header).findByText('Declared for Larch Street Bakehouse (UK rules)')).toBeInTheDocument();
    expect(new URL(FakeEventSource.current().url, 'http://crumbproof.test').searchParams.get('kitchen')).toBe('1');
  });

  it('classifies every product for the allergens picked, on sale today first, in words with a mark', async () => {
    counterApi('front-of-house', [demoCounterView()]);
    const { user } = renderApp('/counter');
    await screen.findByRole('heading', { name: 'Counter', level: 1 });
    await user.click(await screen.findByRole('button', { name: 'Eggs' }));
    await user.click(screen.getByRole('button', { name: 'Sesame seeds' }));
    expect(screen.getByRole('button', { name: 'Eggs' })).toHaveAttribute('aria-pressed', 'true');

    const onSale = screen.getByRole('region', { name: 'On sale today' });
    const names = within(onSale)
      .getAllByRole('button')
      .map((b) => b.querySelector('span')?.textContent);
    expect(names).toEqual(['Chocolate-dipped lemon shortbread', BROWNIE, CAKE]);
    expect(row(CAKE)).toHaveTextContent('Contains');
    expect(row(CAKE)).toHaveTextContent('Has egg in the Vanilla sponge and the Meringue buttercream');
    expect(row(CAKE).querySelector('[data-mark]')).toHaveAttribute('data-mark', 'solid');
    expect(row(BROWNIE)).toHaveTextContent('May containMay contain sesame: made on equipment shared with sesame');
    expect(row(BROWNIE).querySelector('[data-mark]')).toHaveAttribute('data-mark', 'striped');
    expect(screen.getByRole('region', { name: 'Not marked on sale today' })).toHaveTextContent('Summer strawberry tart');
    // Front of house does not print labels.
    expect(screen.queryByRole('link', { name: 'Print the allergen chart' })).toBeNull();
  });

  it('picks one tree nut instead of the group, and clears every pick', async () => {
    counterApi('front-of-house', [demoCounterView()]);
    const { user } = renderApp('/counter');
    await user.click(await screen.findByRole('button', { name: 'Nuts' }));
    await user.click(screen.getByRole('button', { name: 'Pick one of the nuts' }));
    await user.click(within(screen.getByRole('group', { name: 'One of the nuts' })).getByRole('button', { name: 'walnut' }));
    // The walnut replaces the whole group.
    expect(screen.getByRole('button', { name: 'Nuts' })).toHaveAttribute('aria-pressed', 'false');
    await user.click(screen.getByRole('button', { name: 'Vegan' }));
    expect(row(BROWNIE)).toHaveTextContent('Suitable as recorded');
    expect(row(BROWNIE)).toHaveTextContent('No listed walnut, no may-contain of walnut, as recorded; vegan as recorded');
    expect(row(BROWNIE).querySelector('[data-mark]')).toHaveAttribute('data-mark', 'ring');

    await user.click(screen.getByRole('button', { name: 'Clear every pick' }));
    expect(screen.getByRole('button', { name: 'Vegan' })).toHaveAttribute('aria-pressed', 'false');
    expect(row(BROWNIE)).toHaveTextContent('Contains wheat');
    expect(row(BROWNIE)).not.toHaveTextContent('Suitable');
  });

  it('finds a product by part of its name', async () => {
    counterApi('front-of-house', [demoCounterView()]);
    const { user } = renderApp('/counter');
    await user.type(await screen.findByRole('searchbox', { name: 'Find a product' }), 'straw');
    expect(screen.getAllByRole('button', { name: /strawberry/i })).toHaveLength(2);
    expect(screen.queryByRole('button', { name: new RegExp(`^${BROWNIE.replace(/[()]/g, '\\$&')}`) })).toBeNull();
    await user.clear(screen.getByRole('searchbox', { name: 'Find a product' }));
    await user.type(screen.getByRole('searchbox', { name: 'Find a product' }), 'quince');
    expect(screen.getByText('No product for sale is called anything like “quince”.')).toBeInTheDocument();
  });

  it('opens a card with the answer first, the sentences to read out, the caution and the ingredients under More detail', async () => {
    counterApi('front-of-house', [demoCounterView()]);
    const { user } = renderApp('/counter');
    await user.click(await screen.findByRole('button', { name: 'Eggs' }));
    await user.click(row(CAKE));
    const card = await screen.findByRole('dialog', { name: CAKE });
    expect(within(card).getByRole('group', { name: 'The answer' })).toHaveTextContent(
      'ContainsHas egg in the Vanilla sponge and the Meringue buttercream.For a customer avoiding eggs.',
    );
    // Where the egg comes from, as layer paths, product on top.
    const paths = within(card)
      .getAllByRole('list', { name: /^Layer path: / })
      .map((p) => p.getAttribute('aria-label'));
    expect(paths).toHaveLength(2);
    expect(paths[0]).toMatch(/^Layer path: Strawberry and vanilla layer cake → Vanilla sponge → .+/);
    expect(paths[1]).toMatch(/^Layer path: Strawberry and vanilla layer cake → Meringue buttercream → Italian meringue → .+/);
    expect(within(card).queryByRole('link', { name: 'Vanilla sponge' })).toBeNull();
    expect(within(card).getByRole('note', { name: 'Caution' })).toHaveTextContent(
      /comes from the recipes and supplier information recorded/,
    );
    expect(card).toHaveTextContent('Not known: Sugar strands has no allergen statement, so nothing can be said of its allergens.');
    expect(card).toHaveTextContent('It is made on equipment shared with sesame.');
    expect(card).not.toHaveTextContent(/\bsafe\b/i);

    await user.click(within(card).getByRole('button', { name: 'More detail' }));
    const bold = [...card.querySelectorAll('strong')].map((s) => s.textContent);
    expect(bold).toEqual(expect.arrayContaining(['wheat', 'milk']));
    await user.click(within(card).getByRole('button', { name: 'Close the card' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
  });

  it('says what a claim that holds stands on, naming the ingredients resting on a supplier statement alone', async () => {
    const view = demoCounterView();
    const brownie = view.products.find((p) => p.id === 'vegan-brownie')!;
    expect(brownie.declaration.claims.vegan.status).toBe('ok');
    brownie.declaration = {
      ...brownie.declaration,
      claimBasis: { checked: 7, statementOnly: [{ id: 'caster-sugar', name: 'Caster sugar', why: 'no-specification' }] },
    };
    const cake = view.products.find((p) => p.id === 'strawberry-layer-cake')!;
    cake.declaration = { ...cake.declaration, claimBasis: { checked: 12, statementOnly: [] } };
    counterApi('front-of-house', [view]);
    const { user } = renderApp('/counter');
    await user.click(await screen.findByRole('button', { name: 'Eggs' }));
    await user.click(row(BROWNIE));
    const card = await screen.findByRole('dialog', { name: BROWNIE });
    const basis = within(card).getByTestId('counter-claim-basis');
    expect(basis).toHaveTextContent(
      '1 of 7 ingredients has no specification on file or one past its review date, so the claim rests on what the supplier states',
    );
    expect(basis).toHaveTextContent('Resting on a supplier statement alone: Caster sugar (no specification).');
    expect(basis.querySelector('[data-basis-mark]')).toHaveAttribute('data-basis-mark', 'bubble');
    await user.click(within(card).getByRole('button', { name: 'Close the card' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());

    // Every ingredient with a current specification: the sheet mark, and no names to list.
    await user.click(row(CAKE));
    const cakeBasis = within(await screen.findByRole('dialog', { name: CAKE })).getByTestId('counter-claim-basis');
    expect(cakeBasis).toHaveTextContent('All 12 ingredients checked against a specification on file.');
    expect(cakeBasis).not.toHaveTextContent('Resting on a supplier statement alone');
    expect(cakeBasis.querySelector('[data-basis-mark]')).toHaveAttribute('data-basis-mark', 'sheet');
  });

  it('asks the kitchen for the allergens picked, says when it was sent, and shows the answer when it comes', async () => {
    let asked: CounterQuestionView[] = [];
    const { calls } = counterApi('front-of-house', [demoCounterView()], {
      'GET /api/counter/questions': () => ({ body: asked }),
      'POST /api/counter/questions': ({ body }) => {
        asked = [question({ note: (body as { note?: string }).note ?? null })];
        return { status: 201, body: asked[0] };
      },
    });
    const { user } = renderApp('/counter');
    await user.click(await screen.findByRole('button', { name: 'Eggs' }));
    await user.click(screen.getByRole('button', { name: 'Sesame seeds' }));
    FakeEventSource.current().open();
    await user.click(row(BROWNIE));
    await user.click(within(await screen.findByRole('dialog')).getByRole('button', { name: 'Ask the kitchen' }));
    const form = await screen.findByRole('dialog', { name: `Ask the kitchen about ${BROWNIE}` });
    expect(form).toHaveTextContent('The customer avoids eggs and sesame seeds.');
    await user.type(within(form).getByLabelText('Note for the kitchen (optional)'), 'Severe sesame allergy');
    await user.click(within(form).getByRole('button', { name: 'Send to the kitchen' }));
    expect(await within(form).findByRole('status')).toHaveTextContent(/^Sent to the kitchen at \d\d:\d\d\.$/);
    expect(calls.filter((c) => c.method === 'POST').map((c) => c.body)).toEqual([
      { product: 'vegan-brownie', avoid: ['eggs', 'sesame'], note: 'Severe sesame allergy' },
    ]);

    await user.click(within(form).getByRole('button', { name: 'Back to the product' }));
    const card = await screen.findByRole('dialog', { name: BROWNIE });
    expect(await within(card).findByText('Waiting for the kitchen’s answer.')).toBeInTheDocument();

    asked = [
      question({
        note: 'Severe sesame allergy',
        answer: { text: 'No sesame on that bench today.', by: 'Teodor Lind', at: '2026-12-02T08:40:00.000Z' },
      }),
    ];
    FakeEventSource.current().push({ type: 'question-answered', question: 7, product: 'vegan-brownie' });
    expect(await within(card).findByText('No sesame on that bench today.')).toBeInTheDocument();
  });

  it("lists a question on the kitchen's Questions view as soon as it is asked elsewhere", async () => {
    let asked: CounterQuestionView[] = [];
    counterApi('pastry-chef', [demoCounterView()], { 'GET /api/counter/questions': () => ({ body: asked }) });
    renderApp('/counter/questions');
    await screen.findByRole('heading', { name: 'Counter', level: 1 });
    FakeEventSource.current().open();
    expect(await screen.findByText(/^No questions have been asked yet/)).toBeInTheDocument();
    expect(screen.queryByText('Note: Severe sesame allergy')).toBeNull();
    asked = [question({ note: 'Severe sesame allergy' })];
    FakeEventSource.current().push({ type: 'question-asked', question: 7, product: 'vegan-brownie' });
    expect(await screen.findByText('Note: Severe sesame allergy')).toBeInTheDocument();
  });

  it('refuses to ask the kitchen with no allergen picked, and says so', async () => {
    const { calls } = counterApi('front-of-house', [demoCounterView()]);
    const { user } = renderApp('/counter');
    await user.click(await screen.findByRole('button', { name: 'Vegan' }));
    await user.click(row(BROWNIE));
    await user.click(within(await screen.findByRole('dialog')).getByRole('button', { name: 'Ask the kitchen' }));
    const form = await screen.findByRole('dialog', { name: `Ask the kitchen about ${BROWNIE}` });
    expect(within(form).getByRole('alert')).toHaveTextContent('pick at least one allergen the customer must avoid');
    expect(within(form).getByRole('button', { name: 'Send to the kitchen' })).toBeDisabled();
    expect(calls.some((c) => c.method === 'POST')).toBe(false);
  });
});

describe('the counter stays live', () => {
  beforeEach(() => stubEventSource());

  it('shows a pushed change to a declaration without a reload, in the list and in the open card', async () => {
    const before = demoCounterView();
    // The kitchen records egg in the brownie's spread.
    const after = demoCounterView(undefined, '2026-12-02T08:50:00.000Z');
    const brownie = after.products.find((p) => p.id === 'vegan-brownie')!;
    brownie.declaration = {
      ...brownie.declaration,
      contains: [
        ...brownie.declaration.contains,
        { allergen: 'eggs', label: 'eggs', sources: ['egg'], via: [['vegan-brownie', 'plant-spread']] },
      ],
    };
    counterApi('front-of-house', [before, after]);
    const { user } = renderApp('/counter');
    await user.click(await screen.findByRole('button', { name: 'Eggs' }));
    FakeEventSource.current().open();
    expect(row(BROWNIE)).toHaveTextContent('Suitable as recorded');
    await user.click(row(BROWNIE));
    const card = await screen.findByRole('dialog', { name: BROWNIE });

    FakeEventSource.current().push({ type: 'declarations-changed', products: ['vegan-brownie'] });
    await waitFor(() =>
      expect(within(card).getByRole('group', { name: 'The answer' })).toHaveTextContent('Has egg in the Plant-based baking spread'),
    );
    expect(screen.getByText(/^Computed at \d\d:\d\d; live/)).toBeInTheDocument();
  });

  it('says it is not live when the stream drops, keeps the data, and clears only after a fresh read once reconnected', async () => {
    let fail = false;
    let reads = 0;
    mockApi(
      signedInAs('front-of-house', {
        'GET /api/counter/products': () => {
          reads += 1;
          return fail
            ? { status: 503, body: { statusCode: 503, code: 'internal', message: 'The server is restarting.' } }
            : { body: demoCounterView() };
        },
        'GET /api/counter/questions': { body: [] },
      }),
    );
    renderApp('/counter');
    await screen.findByRole('button', { name: 'Eggs' });
    FakeEventSource.current().open();
    expect(screen.queryByRole('alert')).toBeNull();

    FakeEventSource.current().drop();
    const banner = await screen.findByRole('alert');
    expect(banner).toHaveTextContent(/^Not live since \d\d:\d\d: showing the data computed at \d\d:\d\d\. Reconnecting…/);
    expect(row(BROWNIE)).toBeInTheDocument();

    // Back, but the catch-up read fails: still not live.
    fail = true;
    const readsBefore = reads;
    FakeEventSource.current().open();
    await waitFor(() => expect(reads).toBeGreaterThan(readsBefore));
    expect(screen.getByRole('alert')).toHaveTextContent(/^Not live since/);
    expect(row(BROWNIE)).toBeInTheDocument();

    // The next try reads it: live again.
    fail = false;
    await waitFor(() => expect(screen.queryByRole('alert')).toBeNull(), { timeout: 8000 });
    expect(screen.getByText(/^Computed at \d\d:\d\d; live/)).toBeInTheDocument();
  });

  it('moves a product to On sale today when the day is marked again elsewhere', async () => {
    counterApi('front-of-house', [demoCounterView([]), demoCounterView(['strawberry-tart'])]);
    renderApp('/counter');
    await screen.findByRole('button', { name: 'Eggs' });
    FakeEventSource.current().open();
    expect(screen.queryByRole('region', { name: 'On sale today' })).toBeNull();
    FakeEventSource.current().push({ type: 'display-changed', date: '2026-12-02' });
    const onSale = await screen.findByRole('region', { name: 'On sale today' });
    expect(onSale).toHaveTextContent('Summer strawberry tart');
    expect(screen.getByRole('region', { name: 'Not marked on sale today' })).not.toHaveTextContent('Summer strawberry tart');
  });

  it('opens a new stream after a while when the server closed it for good', async () => {
    counterApi('front-of-house', [demoCounterView()]);
    renderApp('/counter');
    await screen.findByRole('button', { name: 'Eggs' });
    const first = FakeEventSource.current();
    first.open();
    first.drop(FakeEventSource.CLOSED);
    expect(await screen.findByRole('alert')).toHaveTextContent(/^Not live since/);
    await waitFor(() => expect(FakeEventSource.opened.length).toBe(2), { timeout: 6000 });
    FakeEventSource.current().open();
    await waitFor(() => expect(screen.queryByRole('alert')).toBeNull());
  });

  it('opens a new stream at once when the browser is back online', async () => {
    counterApi('front-of-house', [demoCounterView()]);
    renderApp('/counter');
    await screen.findByRole('button', { name: 'Eggs' });
    FakeEventSource.current().open();
    act(() => void window.dispatchEvent(new Event('offline')));
    expect(await screen.findByRole('alert')).toHaveTextContent(/^Not live since/);
    const first = FakeEventSource.current();
    act(() => void window.dispatchEvent(new Event('online')));
    await waitFor(() => expect(FakeEventSource.current()).not.toBe(first));
    expect(first.readyState).toBe(FakeEventSource.CLOSED);
    FakeEventSource.current().open();
    await waitFor(() => expect(screen.queryByRole('alert')).toBeNull());
  });
});

describe('the counter’s views', () => {
  beforeEach(() => stubEventSource());

  it('has the three views at their own addresses, the open questions counted, and the chart one click away for the kitchen', async () => {
    counterApi('pastry-chef', [demoCounterView()], { 'GET /api/counter/questions': { body: [question()] } });
    const { user, router } = renderApp('/counter');
    const views = await screen.findByRole('navigation', { name: 'Counter views' });
    expect(within(views).getByRole('link', { name: 'Look up' })).toHaveAttribute('aria-current', 'page');
    const questions = await within(views).findByRole('link', { name: 'Questions (1 open)' });
    await user.click(questions);
    // Each view is its own route, so the page is drawn again once its route has loaded.
    await waitFor(() => expect(router.state.location.pathname).toBe('/counter/questions'));
    const shown = () => screen.getByRole('navigation', { name: 'Counter views' });
    await waitFor(() => expect(within(shown()).getByRole('link', { name: 'Questions (1 open)' })).toHaveAttribute('aria-current', 'page'));
    await user.click(within(shown()).getByRole('link', { name: 'On sale' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/counter/on-sale'));

    const chart = screen.getByRole('link', { name: 'Print the allergen chart' });
    expect(chart).toHaveAttribute('href', '/labels?template=chart');
  });

  it('says so for a view that does not exist', async () => {
    counterApi('front-of-house', [demoCounterView()]);
    renderApp('/counter/menu');
    expect(await screen.findByText('The counter has no view called “menu”. Pick one of the views above.')).toBeInTheDocument();
  });
});
