import type { BookProblem, BookRecipe, StaleBase } from '@crumbproof/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, signedInAs, type ApiHandlers } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';
import { declarationFor, INGREDIENTS, RECIPES } from '../testing/fixtures';

function editorApi(extra: ApiHandlers = {}) {
  return mockApi(
    signedInAs('pastry-chef', {
      'GET /api/recipes': { body: RECIPES },
      'GET /api/ingredients': { body: INGREDIENTS },
      'GET /api/recipes/victoria-sponge': { body: RECIPES[0] },
      'POST /api/declarations/preview': { body: declarationFor() },
      ...extra,
    }),
  );
}

const jamMessage =
  "Line 2 of Victoria sponge uses 'jam' in 'each', but Raspberry jam has no weight per unit. Add the weight of one raspberry jam, or write the line in grams.";

/** A refusal as the API sends it: the message for people, the problems with their ids. */
function refused(problems: BookProblem[]) {
  return {
    status: 400,
    body: { statusCode: 400, code: problems[0]!.code, message: problems.map((p) => p.message).join(' '), problems },
  };
}

const jamLine: BookProblem = {
  code: 'unweighable-line',
  recipe: 'victoria-sponge',
  field: 'unit',
  line: 2,
  use: 'jam',
  unit: 'each',
  needs: 'gEach',
  message: jamMessage,
};
const unweighable = refused([jamLine]);

/** Whether the pickers of lines 1 to 3 are each marked invalid. */
function lineMarks() {
  return [1, 2, 3].map((n) => {
    const picker = screen.getByRole('combobox', { name: `Ingredient or recipe for line ${n}` });
    return picker.getAttribute('aria-invalid') === 'true';
  });
}

/** The refusal of a save from revision 4 of the sponge: Maren saved revision 5 with the finished weight at 850 g. */
function staleSponge(changes: StaleBase['saves'][number]['changes']): StaleBase {
  const { revision: _r, updatedAt: _u, ...body } = RECIPES[0]!;
  return {
    kind: 'recipe',
    id: 'victoria-sponge',
    name: 'Victoria sponge',
    baseRevision: 4,
    currentRevision: 5,
    saves: [{ revision: 5, authorId: 2, authorName: 'Maren Holloway', savedAt: '2026-12-02T15:50:00.000Z', note: 'Edited', changes }],
    changes: [],
    current: { ...body, finishedWeightG: 850 },
  };
}

/** Renames the sponge in the editor and saves it. */
async function renameAndSave(user: ReturnType<typeof renderApp>['user']) {
  const name = await screen.findByLabelText('Recipe name');
  await user.clear(name);
  await user.type(name, 'Victoria sandwich');
  await user.click(screen.getByRole('button', { name: 'Save recipe' }));
}

/** Opens the sponge's editor with saving answered, and adds a fourth line of plant spread picked by typing. */
async function addPlantSpreadLine() {
  let saved: BookRecipe | null = null;
  const { calls } = editorApi({
    'PUT /api/recipes/victoria-sponge': ({ body }) => {
      saved = body as BookRecipe;
      return { body: { ...(body as BookRecipe), revision: 5, updatedAt: '2026-12-01T19:00:00.000Z' } };
    },
    'GET /api/recipes/victoria-sponge/declaration': { body: declarationFor() },
    'GET /api/recipes/victoria-sponge/revisions': { body: [] },
  });
  const { user, router } = renderApp('/recipes/victoria-sponge/edit');
  await screen.findByRole('heading', { level: 1, name: 'Edit Victoria sponge' });
  await user.click(screen.getByRole('button', { name: 'Add line' }));
  const picker = screen.getByRole('combobox', { name: 'Ingredient or recipe for line 4' });
  await user.type(picker, 'plant');
  await user.click(await screen.findByRole('option', { name: /Plant spread/ }));
  return { saved: () => saved, calls, user, router, picker };
}

describe('Recipe editor', () => {
  it('loads the recipe into the form with its lines, and the live declaration beside it', async () => {
    const { calls } = editorApi();
    renderApp('/recipes/victoria-sponge/edit');

    expect(await screen.findByRole('heading', { level: 1, name: 'Edit Victoria sponge' })).toBeInTheDocument();
    expect(screen.getByLabelText('Recipe name')).toHaveValue('Victoria sponge');
    await waitFor(() => expect(screen.getByRole('combobox', { name: 'Ingredient or recipe for line 1' })).toHaveValue('Vanilla sponge'));
    expect(screen.getByRole('spinbutton', { name: 'Quantity for line 1' })).toHaveValue(800);
    expect(screen.getByRole('combobox', { name: 'Unit for line 1' })).toHaveValue('g');
    expect(screen.getByRole('combobox', { name: 'Role for line 3' })).toHaveValue('contact');
    // A contact line takes no weight: no quantity box, and words in its place.
    expect(screen.queryByRole('spinbutton', { name: 'Quantity for line 3' })).not.toBeInTheDocument();
    expect(screen.getByText('No weight: brings its allergens only')).toBeInTheDocument();
    // The words wrap within their columns: the table's cells would otherwise cut them short under the role.
    expect(getComputedStyle(screen.getByText('No weight: brings its allergens only')).whiteSpace).toBe('normal');
    expect(screen.getByLabelText('Weight after baking (g)')).toHaveValue(900);
    expect(screen.getByLabelText('For sale')).toBeChecked();
    expect(screen.getByLabelText('Portion (g)')).toHaveValue(90);

    const live = screen.getByRole('region', { name: 'Live declaration' });
    expect(await within(live).findByText('Vegan: Fails')).toBeInTheDocument();
    const preview = calls.find((call) => call.path === '/api/declarations/preview');
    expect(preview?.body).toEqual({
      id: 'victoria-sponge',
      name: 'Victoria sponge',
      lines: RECIPES[0]!.lines,
      finishedWeightG: 900,
      sale: { portionG: 90, claims: ['vegetarian'], quid: ['jam'] },
    });
  });

  it('adds a line picked by typing, previews it and saves it, then opens the product page at the new revision', async () => {
    const { saved, calls, user, router, picker } = await addPlantSpreadLine();
    expect(picker).toHaveValue('Plant spread');
    await user.type(screen.getByRole('spinbutton', { name: 'Quantity for line 4' }), '50');

    // The preview follows the form once typing pauses.
    await waitFor(() =>
      expect(
        calls.some(
          (call) =>
            call.path === '/api/declarations/preview' &&
            (call.body as BookRecipe).lines.some((line) => line.use === 'plant-spread' && line.qty === 50),
        ),
      ).toBe(true),
    );
    expect(within(screen.getByRole('region', { name: 'Live declaration' })).getByText('Not saved yet')).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Save recipe' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/recipes/victoria-sponge'));
    expect(saved()!.lines.at(-1)).toEqual({ use: 'plant-spread', qty: 50, unit: 'g' });
    expect(await screen.findByText('Saved. This is revision 5.')).toBeInTheDocument();
  });

  it('when someone else saved the recipe first, names them and their change, and saves over theirs only when asked, from their revision', async () => {
    const stale = staleSponge([
      {
        field: 'finishedWeightG',
        label: 'Finished weight',
        before: '900 g',
        after: '850 g',
        text: 'Finished weight: changed from 900 g to 850 g.',
      },
    ]);
    const puts: Record<string, unknown>[] = [];
    const { calls } = editorApi({
      'PUT /api/recipes/victoria-sponge': ({ body: sent }) => {
        puts.push(sent as Record<string, unknown>);
        return puts.length === 1
          ? {
              status: 409,
              body: { statusCode: 409, code: 'stale-base', message: 'Someone else saved this recipe while you were editing.', stale },
            }
          : { body: { ...(sent as BookRecipe), revision: 6, updatedAt: '2026-12-02T15:55:00.000Z' } };
      },
      'GET /api/recipes/victoria-sponge/declaration': { body: declarationFor() },
      'GET /api/recipes/victoria-sponge/revisions': { body: [] },
    });
    const { user, router } = renderApp('/recipes/victoria-sponge/edit');

    await renameAndSave(user);

    const panel = await screen.findByRole('alert', { name: 'Someone else saved this while you were editing' });
    expect(panel).toHaveTextContent(/Maren Holloway saved revision 5 on 2 Dec 2026/);
    expect(within(panel).getByRole('listitem')).toHaveTextContent('Finished weight: changed from 900 g to 850 g.');
    expect(screen.getByLabelText('Recipe name')).toHaveValue('Victoria sandwich');
    expect(router.state.location.pathname).toBe('/recipes/victoria-sponge/edit');
    expect(puts).toEqual([expect.objectContaining({ name: 'Victoria sandwich', baseRevision: 4 })]);

    await user.click(within(panel).getByRole('button', { name: 'Save my values over theirs' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/recipes/victoria-sponge'));
    expect(puts).toEqual([
      expect.objectContaining({ name: 'Victoria sandwich', baseRevision: 4 }),
      expect.objectContaining({ name: 'Victoria sandwich', baseRevision: 5 }),
    ]);
    expect(calls.filter((call) => call.method === 'PUT')).toHaveLength(2);
  });

  it('reloads their version of the recipe into the editor without saving', async () => {
    const stale = staleSponge([]);
    const { calls } = editorApi({
      'PUT /api/recipes/victoria-sponge': {
        status: 409,
        body: { statusCode: 409, code: 'stale-base', message: 'Someone else saved this recipe.', stale },
      },
    });
    const { user } = renderApp('/recipes/victoria-sponge/edit');
    await renameAndSave(user);
    const panel = await screen.findByRole('alert', { name: 'Someone else saved this while you were editing' });
    expect(panel).toHaveTextContent('It changed no field.');

    await user.click(within(panel).getByRole('button', { name: 'Reload their version' }));
    expect(screen.getByLabelText('Recipe name')).toHaveValue('Victoria sponge');
    expect(screen.getByLabelText('Weight after baking (g)')).toHaveValue(850);
    expect(screen.getByText('Showing revision 5, as Maren Holloway saved it.')).toBeInTheDocument();
    expect(screen.getByText('Saving creates revision 6.')).toBeInTheDocument();
    expect(calls.filter((call) => call.method === 'PUT')).toHaveLength(1);
  });

  it('saves a contact line with no quantity: choosing the role takes the weight boxes away', async () => {
    const { saved, user, router } = await addPlantSpreadLine();
    await user.type(screen.getByRole('spinbutton', { name: 'Quantity for line 4' }), '3');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Role for line 4' }), 'contact');
    expect(screen.queryByRole('spinbutton', { name: 'Quantity for line 4' })).not.toBeInTheDocument();
    expect(screen.getAllByText('No weight: brings its allergens only')).toHaveLength(2);

    await user.click(screen.getByRole('button', { name: 'Save recipe' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/recipes/victoria-sponge'));
    expect(saved()!.lines.at(-1)).toEqual({ use: 'plant-spread', role: 'contact' });
  });

  it('shows a line the API cannot weigh in place on that line, and in an alert', async () => {
    editorApi({ 'POST /api/declarations/preview': unweighable });
    renderApp('/recipes/victoria-sponge/edit');

    const line2 = await screen.findByRole('combobox', { name: 'Ingredient or recipe for line 2' });
    await waitFor(() => expect(line2).toHaveAttribute('aria-invalid', 'true'));
    expect(line2).toHaveAccessibleDescription(expect.stringContaining('Raspberry jam has no weight per unit'));
    expect(screen.getByRole('combobox', { name: 'Ingredient or recipe for line 1' })).not.toHaveAttribute('aria-invalid');
    const live = screen.getByRole('region', { name: 'Live declaration' });
    expect(within(live).getByRole('alert')).toHaveTextContent("Line 2 of Victoria sponge uses 'jam' in 'each'");
  });

  it('marks the line that closes a recipe cycle: the one using the next recipe of the cycle', async () => {
    const message = 'Vanilla sponge contains itself: Vanilla sponge → Victoria sponge → Vanilla sponge. Remove one of these lines.';
    editorApi({
      'POST /api/declarations/preview': refused([{ code: 'recipe-cycle', recipes: ['vanilla-sponge', 'victoria-sponge'], message }]),
    });
    renderApp('/recipes/victoria-sponge/edit');

    const line1 = await screen.findByRole('combobox', { name: 'Ingredient or recipe for line 1' });
    await waitFor(() => expect(line1).toHaveAttribute('aria-invalid', 'true'));
    expect(line1).toHaveAccessibleDescription(expect.stringContaining('contains itself'));
    expect(lineMarks()).toEqual([true, false, false]);
    expect(within(screen.getByRole('region', { name: 'Live declaration' })).getByRole('alert')).toHaveTextContent(message);
  });

  it('places a problem on the line its ids name, whatever its words say, and leaves another recipe’s problem off these lines', async () => {
    editorApi({
      'POST /api/declarations/preview': refused([
        { ...jamLine, line: 3, use: 'flour', message: 'Plain wheat flour cannot be weighed in this unit.' },
        { ...jamLine, recipe: 'vanilla-sponge', line: 1, use: 'flour', message: 'Vanilla sponge has a line that cannot be weighed.' },
      ]),
    });
    renderApp('/recipes/victoria-sponge/edit');

    const line3 = await screen.findByRole('combobox', { name: 'Ingredient or recipe for line 3' });
    await waitFor(() => expect(line3).toHaveAttribute('aria-invalid', 'true'));
    expect(line3).toHaveAccessibleDescription('Plain wheat flour cannot be weighed in this unit.');
    expect(lineMarks()).toEqual([false, false, true]);
    expect(within(screen.getByRole('region', { name: 'Live declaration' })).getByRole('alert')).toHaveTextContent(
      'Vanilla sponge has a line that cannot be weighed.',
    );
  });

  it('marks the line whose id the kitchen does not have when a save is refused', async () => {
    const message = "Line 1 of Victoria sponge uses 'vanilla-sponge', which is neither an ingredient nor a recipe in this book.";
    editorApi({
      'PUT /api/recipes/victoria-sponge': refused([
        { code: 'unknown-reference', recipe: 'victoria-sponge', field: 'use', line: 1, use: 'vanilla-sponge', message },
      ]),
    });
    const { user } = renderApp('/recipes/victoria-sponge/edit');

    await screen.findByRole('heading', { level: 1, name: 'Edit Victoria sponge' });
    await user.click(screen.getByRole('button', { name: 'Save recipe' }));
    expect(await screen.findByText(/^Nothing was saved\./)).toHaveTextContent(message);
    expect(lineMarks()).toEqual([true, false, false]);
    expect(screen.getByRole('combobox', { name: 'Ingredient or recipe for line 1' })).toHaveAccessibleDescription(message);
  });

  it('keeps the form and says nothing was saved when the API refuses the save', async () => {
    const { calls } = editorApi({ 'PUT /api/recipes/victoria-sponge': unweighable });
    const { user, router } = renderApp('/recipes/victoria-sponge/edit');

    await screen.findByRole('heading', { level: 1, name: 'Edit Victoria sponge' });
    await user.click(screen.getByRole('button', { name: 'Save recipe' }));
    const alert = await screen.findByText(/^Nothing was saved\./);
    expect(alert).toHaveTextContent('Raspberry jam has no weight per unit');
    expect(screen.getByRole('combobox', { name: 'Ingredient or recipe for line 2' })).toHaveAttribute('aria-invalid', 'true');
    expect(router.state.location.pathname).toBe('/recipes/victoria-sponge/edit');
    expect(calls.filter((call) => call.method === 'PUT')).toHaveLength(1);
  });

  it('shows a line weight out of proportion beside that line, as a warning that does not stop saving', async () => {
    const message =
      "Line 2 (Raspberry jam) weighs 5000 g, more than the whole finished weight of Victoria sponge (850 g). Check the line's quantity and unit (g or kg), and the finished weight.";
    const { calls } = editorApi({
      'POST /api/declarations/preview': {
        body: declarationFor({ warnings: [{ code: 'line-weight-out-of-proportion', line: 2, message }] }),
      },
      'PUT /api/recipes/victoria-sponge': { body: RECIPES[0] },
    });
    const { user } = renderApp('/recipes/victoria-sponge/edit');

    const qty2 = await screen.findByRole('spinbutton', { name: 'Quantity for line 2' });
    await waitFor(() => expect(qty2).toHaveAccessibleDescription(`Check: ${message}`));
    expect(screen.getByRole('combobox', { name: 'Ingredient or recipe for line 2' })).toHaveAccessibleDescription(`Check: ${message}`);
    expect(qty2).not.toHaveAttribute('aria-invalid');
    expect(screen.getByRole('spinbutton', { name: 'Quantity for line 1' })).not.toHaveAccessibleDescription();
    expect(screen.getByRole('combobox', { name: 'Ingredient or recipe for line 3' })).not.toHaveAccessibleDescription();
    await user.click(screen.getByRole('button', { name: 'Save recipe' }));
    await waitFor(() => expect(calls.some((call) => call.method === 'PUT')).toBe(true));
  });

  it('marks a zero or negative quantity on its box as it is typed, before any save', async () => {
    const { calls } = editorApi();
    const { user } = renderApp('/recipes/victoria-sponge/edit');

    const qty1 = await screen.findByRole('spinbutton', { name: 'Quantity for line 1' });
    expect(qty1).not.toHaveAttribute('aria-invalid');
    await user.clear(qty1);
    await user.type(qty1, '0');
    expect(qty1).toHaveAttribute('aria-invalid', 'true');
    expect(qty1).toHaveAccessibleDescription('Quantity: Give a quantity above zero.');
    await user.clear(qty1);
    await user.type(qty1, '-3');
    expect(qty1).toHaveAttribute('aria-invalid', 'true');
    await user.clear(qty1);
    await user.type(qty1, '250');
    expect(qty1).not.toHaveAttribute('aria-invalid');
    expect(qty1).not.toHaveAccessibleDescription();
    expect(calls.some((call) => call.method === 'PUT')).toBe(false);
  });

  it('warns before saving when a claim the sale details want does not hold', async () => {
    editorApi();
    const { user } = renderApp('/recipes/victoria-sponge/edit');

    const vegan = await screen.findByRole('checkbox', { name: 'Vegan' });
    await user.click(vegan);
    const live = screen.getByRole('region', { name: 'Live declaration' });
    const notice = await within(live).findByText(/^Vegan is wanted but fails/);
    expect(notice).toHaveTextContent('Vegan is wanted but fails: Butter (Vanilla sponge → Butter) contains milk.');
    // Vegetarian is wanted too, and holds: no notice for it.
    expect(within(live).queryByText(/^Vegetarian is wanted/)).not.toBeInTheDocument();
  });

  it('words the claims the kitchen wants apart from what the recipe supports, and follows the ticks', async () => {
    editorApi();
    const { user } = renderApp('/recipes/victoria-sponge/edit');

    const wanted = await screen.findByRole('group', { name: 'Claims you want to make' });
    expect(within(wanted).getByRole('checkbox', { name: 'Vegetarian' })).toBeChecked();
    const live = screen.getByRole('region', { name: 'Live declaration' });
    const supports = await within(live).findByRole('region', { name: 'What the recipe supports' });
    const vegan = await within(supports).findByText('Vegan: Fails');
    expect(vegan.closest('li')).toHaveTextContent('Not among the claims you want to make.');
    await user.click(within(wanted).getByRole('checkbox', { name: 'Vegan' }));
    await waitFor(() => expect(within(supports).getByText('Vegan: Fails').closest('li')).toHaveTextContent('You want to make this claim.'));
  });

  it('checks the form with the book schema before sending', async () => {
    const { calls } = editorApi();
    const { user } = renderApp('/recipes/victoria-sponge/edit');

    const name = await screen.findByLabelText('Recipe name');
    await user.clear(name);
    await user.click(screen.getByRole('button', { name: 'Save recipe' }));
    expect(await screen.findByText('Give the recipe a name.')).toBeInTheDocument();
    expect(calls.some((call) => call.method === 'PUT')).toBe(false);
  });

  it('creates a new recipe with its own id', async () => {
    const { calls } = editorApi({
      'POST /api/recipes': ({ body }) => ({
        status: 201,
        body: { ...(body as BookRecipe), revision: 1, updatedAt: '2026-12-01T19:00:00.000Z' },
      }),
      'GET /api/recipes/lemon-curd': {
        body: {
          id: 'lemon-curd',
          name: 'Lemon curd',
          lines: [{ use: 'butter', qty: 100, unit: 'g' }],
          revision: 1,
          updatedAt: '2026-12-01T19:00:00.000Z',
        },
      },
      'GET /api/recipes/lemon-curd/declaration': { body: declarationFor({ product: 'lemon-curd', name: 'Lemon curd' }) },
      'GET /api/recipes/lemon-curd/revisions': { body: [] },
    });
    const { user, router } = renderApp('/recipes/new');

    expect(await screen.findByRole('heading', { level: 1, name: 'New recipe' })).toBeInTheDocument();
    await user.type(screen.getByLabelText('Recipe name'), 'Lemon curd');
    await user.type(screen.getByLabelText('Recipe id'), 'lemon-curd');
    const picker = screen.getByRole('combobox', { name: 'Ingredient or recipe for line 1' });
    await user.type(picker, 'butt');
    await user.keyboard('{ArrowDown}{Enter}');
    expect(picker).toHaveValue('Butter');
    await user.type(screen.getByRole('spinbutton', { name: 'Quantity for line 1' }), '100');
    await user.click(screen.getByRole('button', { name: 'Save recipe' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/recipes/lemon-curd'));
    expect(calls.find((call) => call.method === 'POST' && call.path === '/api/recipes')?.body).toEqual({
      id: 'lemon-curd',
      name: 'Lemon curd',
      lines: [{ use: 'butter', qty: 100, unit: 'g' }],
    });
  });

  it('refuses front of house, naming who can edit', async () => {
    const { calls } = mockApi(signedInAs('front-of-house', { 'GET /api/recipes/victoria-sponge': { body: RECIPES[0] } }));
    renderApp('/recipes/victoria-sponge/edit');

    expect(await screen.findByRole('heading', { level: 1, name: 'Not available to your role' })).toBeInTheDocument();
    expect(screen.getByText(/Only Manager and Pastry chef accounts can edit recipes\./)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Save recipe' })).not.toBeInTheDocument();
    expect(calls.some((call) => call.path === '/api/ingredients')).toBe(false);
  });
});

describe('Recipe editor on a narrow screen', () => {
  it('keeps a summary of the live declaration, which follows an edited line and opens into the whole declaration', async () => {
    editorApi({
      // With a fourth line the kitchen's sesame precaution no longer reaches the recipe.
      'POST /api/declarations/preview': ({ body }) =>
        (body as BookRecipe).lines.length === 4
          ? { body: declarationFor({ mayContain: [], precautions: [], warnings: [] }) }
          : { body: declarationFor() },
    });
    const { user } = renderApp('/recipes/victoria-sponge/edit');
    const summary = await screen.findByRole('region', { name: 'Live declaration summary' });
    await waitFor(() => expect(within(summary).getByText('As saved')).toBeInTheDocument());
    const term = (name: string) => within(summary).getByText(`${name}:`).nextElementSibling as HTMLElement;
    expect(term('Contains')).toHaveTextContent('cereals containing gluten');
    expect(term('Contains')).toHaveTextContent('milk');
    expect(term('Contains')).toHaveTextContent('eggs');
    expect(term('May contain')).toHaveTextContent('sesame');
    expect(term('Not known')).toHaveTextContent('1 ingredient');
    // The sponge wants the vegetarian claim: the summary says how it stands, with its mark.
    expect(term('Claims you want')).toHaveTextContent('Vegetarian: Holds');
    expect(term('Notices')).toHaveTextContent('1 warning');

    await user.click(screen.getByRole('button', { name: 'Add line' }));
    await user.type(screen.getByRole('combobox', { name: 'Ingredient or recipe for line 4' }), 'plant');
    await user.click(await screen.findByRole('option', { name: /Plant spread/ }));
    await user.type(screen.getByRole('spinbutton', { name: 'Quantity for line 4' }), '50');
    await waitFor(() => expect(term('May contain')).toHaveTextContent('None recorded'));
    expect(within(summary).getByText('Not saved yet')).toBeInTheDocument();
    expect(term('Notices')).toHaveTextContent('0 warnings');

    const open = within(summary).getByRole('button', { name: 'Open the full declaration' });
    await user.click(open);
    const drawer = await screen.findByRole('dialog', { name: 'The declaration as edited' });
    const full = within(drawer).getByRole('region', { name: 'Live declaration' });
    expect(within(full).getByText('Vegan: Fails')).toBeInTheDocument();
    expect(within(full).getByText('No may-contain recorded.')).toBeInTheDocument();
    expect(within(full).getByText('Not saved yet')).toBeInTheDocument();

    await user.keyboard('{Escape}');
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    expect(open).toHaveFocus();
  });

  it('says when the summary is not up to date because the form is incomplete', async () => {
    editorApi();
    const { user } = renderApp('/recipes/victoria-sponge/edit');
    const summary = await screen.findByRole('region', { name: 'Live declaration summary' });
    await user.click(screen.getByRole('button', { name: 'Add line' }));
    expect(await within(summary).findByText('Line 4: choose an ingredient or recipe to see the declaration.')).toBeInTheDocument();
    expect(within(summary).getByText('Not up to date')).toBeInTheDocument();
  });
});
