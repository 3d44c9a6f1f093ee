import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockApi, requestUrl, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';
import { IMPORT_COLUMNS, type ImportPreview } from '@crumbproof/shared';

const CSV = new File(['id,name\nbutter,Unsalted butter\n'], 'ingredients.csv', { type: 'text/csv' });

const WITH_PROBLEM: ImportPreview = {
  format: 'csv',
  columns: [
    { header: 'id', aliases: ['code'], field: 'id', required: true, description: 'The ingredient id used in recipes.' },
    { header: 'contains', aliases: [], field: 'contains', required: false, description: "Allergen sources, or 'none'." },
  ],
  rules: [
    "contains: 'none' means the supplier states there are no allergens (verified none); an empty cell means no allergen statement (unknown).",
  ],
  problems: [],
  rows: [
    {
      row: 2,
      idCell: 'butter',
      nameCell: 'Unsalted butter',
      ingredient: { id: 'butter', name: 'Unsalted butter', contains: ['milk'], mayContain: [], vegan: false, vegetarian: true },
      action: 'update',
      problems: [],
      base: { revision: 3, token: '3.butter-token' },
    },
    {
      row: 3,
      idCell: 'rice-flour',
      nameCell: 'Rice flour',
      ingredient: { id: 'rice-flour', name: 'Rice flour', mayContain: [], vegan: true, vegetarian: true },
      action: 'create',
      problems: [],
      base: { revision: null, token: '0.rice-token' },
    },
    {
      row: 4,
      idCell: 'praline',
      nameCell: 'Hazelnut praline',
      ingredient: null,
      action: 'create',
      problems: ["Column 'contains' names 'nuts', which is not an allergen source. Use e.g. 'almond' or 'hazelnut'."],
      base: null,
    },
  ],
  summary: { create: 1, update: 1, unchanged: 0, withProblems: 1 },
  basis: '{"2":"3.butter-token","3":"0.rice-token"}',
};

const CLEAN: ImportPreview = {
  ...WITH_PROBLEM,
  rows: WITH_PROBLEM.rows.slice(0, 2),
  summary: { create: 1, update: 1, unchanged: 0, withProblems: 0 },
};

async function openImport() {
  const view = renderApp('/ingredients/import');
  expect(await screen.findByRole('heading', { level: 1, name: 'Import from spreadsheet' })).toBeInTheDocument();
  return view;
}

describe('Spreadsheet import', () => {
  it('shows each row’s action and problem in words and refuses to import while a row has a problem', async () => {
    const { fetchMock } = mockApi(signedInAs('pastry-chef', { 'POST /api/ingredients/import/preview': { body: WITH_PROBLEM } }));
    const { user } = await openImport();

    await user.upload(screen.getByLabelText(/^Spreadsheet \(CSV or XLSX\)/), CSV);
    await user.click(screen.getByRole('button', { name: 'Check the file' }));

    const table = await screen.findByRole('table', { name: 'Rows of the spreadsheet' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(3);
    expect(rows[0]).toHaveTextContent('Revise');
    expect(rows[1]).toHaveTextContent('Add new');
    expect(rows[2]).toHaveTextContent('Not imported');
    expect(rows[2]).toHaveTextContent("Problem: Column 'contains' names 'nuts', which is not an allergen source.");
    // The unreadable row is still named by its name and id cells.
    expect(rows[2]).toHaveTextContent('Hazelnut praline');
    expect(rows[2]).toHaveTextContent('praline');
    expect(screen.getByText(/1 new, 1 revised, 0 unchanged, 1 row with problems \(not imported\)/)).toBeInTheDocument();

    // All or nothing: the button says nothing will be imported, and the note what the other rows would import.
    expect(screen.getByRole('button', { name: 'Nothing is imported while 1 row has a problem' })).toBeDisabled();
    expect(screen.getByText(/the other rows would import 2 ingredients: 1 new, 1 revised\./)).toBeInTheDocument();
    expect(screen.getByText(/The ingredient id used in recipes/)).toBeInTheDocument();
    expect(screen.getByText(/Correct the rows with problems/)).toBeInTheDocument();

    const sent = fetchMock.mock.calls.find(([url]) => requestUrl(url).endsWith('/import/preview'))?.[1]?.body as FormData;
    expect((sent.get('file') as File).name).toBe('ingredients.csv');
  });

  it('imports a clean file and says what was saved', async () => {
    const { calls } = mockApi(
      signedInAs('pastry-chef', {
        'POST /api/ingredients/import/preview': { body: CLEAN },
        'POST /api/ingredients/import': { body: { create: 1, update: 1, unchanged: 0, withProblems: 0 } },
      }),
    );
    const { user } = await openImport();

    await user.upload(screen.getByLabelText(/^Spreadsheet \(CSV or XLSX\)/), CSV);
    await user.click(screen.getByRole('button', { name: 'Check the file' }));
    const importButton = await screen.findByRole('button', { name: 'Import 2 ingredients: 1 new, 1 revised' });
    expect(importButton).toBeEnabled();
    await user.click(importButton);

    expect(await screen.findByText('Imported 2 ingredients: 1 added, 1 updated.')).toBeInTheDocument();
    await waitFor(() => expect(calls.filter((call) => call.path === '/api/ingredients/import')).toHaveLength(1));
  });

  it('sends the check’s basis, and when an ingredient changed since names each row, who and when, and checks again on request', async () => {
    let previews = 0;
    const { calls, fetchMock } = mockApi(
      signedInAs('pastry-chef', {
        'POST /api/ingredients/import/preview': () => {
          previews++;
          return { body: CLEAN };
        },
        'POST /api/ingredients/import': {
          status: 409,
          body: {
            statusCode: 409,
            code: 'stale-preview',
            message: "Nothing was imported: 1 row's ingredient changed since the preview.",
            staleRows: [
              {
                row: 2,
                id: 'butter',
                previewRevision: 3,
                currentRevision: 4,
                authorName: 'Maren Holloway',
                savedAt: '2026-12-02T16:20:00.000Z',
              },
            ],
          },
        },
      }),
    );
    const { user } = await openImport();
    await user.upload(screen.getByLabelText(/^Spreadsheet \(CSV or XLSX\)/), CSV);
    await user.click(screen.getByRole('button', { name: 'Check the file' }));
    await user.click(await screen.findByRole('button', { name: 'Import 2 ingredients: 1 new, 1 revised' }));

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Someone saved these ingredients after your check: nothing was imported');
    const rows = within(alert).getByRole('list', { name: 'Rows whose ingredient changed since the check' });
    expect(
      within(rows)
        .getAllByRole('listitem')
        .map((item) => item.textContent),
    ).toEqual([
      expect.stringMatching(
        /^Row 2, butter: Maren Holloway saved revision 4 on 2 Dec 2026, \d\d:\d\d; the check compared it with revision 3\.$/,
      ),
    ]);
    const sent = fetchMock.mock.calls
      .filter(([url]) => requestUrl(url).endsWith('/ingredients/import'))
      .map(([, init]) => init?.body as FormData);
    expect(sent.map((form) => form.get('basis'))).toEqual([CLEAN.basis]);

    await user.click(within(alert).getByRole('button', { name: 'Check the file again' }));
    await waitFor(() => expect(previews).toBe(2));
    expect(await screen.findByRole('button', { name: 'Import 2 ingredients: 1 new, 1 revised' })).toBeEnabled();
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
    expect(calls.filter((call) => call.path === '/api/ingredients/import')).toHaveLength(1);
  });

  it('refuses to import when the file as a whole has a problem', async () => {
    mockApi(
      signedInAs('pastry-chef', {
        'POST /api/ingredients/import/preview': { body: { ...CLEAN, problems: ["There is no 'name' column; add one to row 1."] } },
      }),
    );
    const { user } = await openImport();
    await user.upload(screen.getByLabelText(/^Spreadsheet \(CSV or XLSX\)/), CSV);
    await user.click(screen.getByRole('button', { name: 'Check the file' }));
    expect(await screen.findByText("There is no 'name' column; add one to row 1.")).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Nothing is imported while the file has problems' })).toBeDisabled();
  });

  it('lists every column the import reads with its meaning, and the templates, before the first upload', async () => {
    mockApi(signedInAs('pastry-chef'));
    await openImport();
    const list = screen.getByRole('list', { name: 'Columns the import reads' });
    const items = within(list).getAllByRole('listitem');
    expect(items.map((item) => item.textContent)).toEqual(
      IMPORT_COLUMNS.map((c) => `${c.header}${c.required ? ' (required)' : ''}: ${c.description}`),
    );
    expect(items[0]).toHaveTextContent(/^id \(required\): /);
    expect(screen.getByRole('link', { name: 'Template for Excel (.xlsx)' })).toHaveAttribute(
      'href',
      '/api/ingredients/import/template.xlsx?kitchen=1',
    );
    expect(screen.getByRole('link', { name: 'Template as CSV' })).toHaveAttribute('href', '/api/ingredients/import/template.csv?kitchen=1');
  });

  it('says for each row what it will record, with not known kept apart from none', async () => {
    const preview: ImportPreview = {
      ...CLEAN,
      rows: [
        CLEAN.rows[0]!,
        CLEAN.rows[1]!,
        {
          row: 4,
          idCell: 'glucose-syrup',
          nameCell: 'Glucose syrup',
          ingredient: {
            id: 'glucose-syrup',
            name: 'Glucose syrup',
            contains: [],
            mayContain: [{ source: 'wheat', form: 'glucose-syrup' }, 'hazelnut'],
            vegan: true,
            vegetarian: null,
          },
          action: 'update',
          problems: [],
          base: { revision: 2, token: '2.glucose-token' },
        },
      ],
      summary: { create: 1, update: 2, unchanged: 0, withProblems: 0 },
    };
    mockApi(signedInAs('manager', { 'POST /api/ingredients/import/preview': { body: preview } }));
    const { user } = await openImport();
    await user.upload(screen.getByLabelText(/^Spreadsheet \(CSV or XLSX\)/), CSV);
    await user.click(screen.getByRole('button', { name: 'Check the file' }));
    const table = await screen.findByRole('table', { name: 'Rows of the spreadsheet' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows[0]).toHaveTextContent('Contains:milk');
    expect(rows[0]).toHaveTextContent('May contain:No precautionary statement');
    expect(rows[0]).toHaveTextContent('Vegan:No');
    expect(rows[0]).toHaveTextContent('Vegetarian:Yes');
    // No contains: not known; contains []: the supplier states none.
    expect(rows[1]).toHaveTextContent('Contains:Not known (no allergen statement)');
    expect(rows[2]).toHaveTextContent('Contains:None (the supplier states none)');
    expect(rows[2]).toHaveTextContent('May contain:wheat (glucose syrup), hazelnut');
    expect(rows[2]).toHaveTextContent('Vegetarian:Not known');
    expect(screen.getByRole('button', { name: 'Import 3 ingredients: 1 new, 2 revised' })).toBeEnabled();
  });

  it('says there is nothing to import when every row matches what is saved', async () => {
    mockApi(
      signedInAs('pastry-chef', {
        'POST /api/ingredients/import/preview': {
          body: {
            ...CLEAN,
            rows: CLEAN.rows.map((r) => ({ ...r, action: 'unchanged' })),
            summary: { create: 0, update: 0, unchanged: 2, withProblems: 0 },
          },
        },
      }),
    );
    const { user } = await openImport();
    await user.upload(screen.getByLabelText(/^Spreadsheet \(CSV or XLSX\)/), CSV);
    await user.click(screen.getByRole('button', { name: 'Check the file' }));
    expect(await screen.findByRole('button', { name: 'Nothing to import' })).toBeDisabled();
  });

  it('asks for a file before checking', async () => {
    const { calls } = mockApi(signedInAs('pastry-chef'));
    const { user } = await openImport();
    await user.click(screen.getByRole('button', { name: 'Check the file' }));
    expect(await screen.findByText(/Choose a spreadsheet first/)).toBeInTheDocument();
    expect(calls.some((call) => call.method === 'POST' && call.path.includes('import'))).toBe(false);
  });
});
