import ExcelJS from 'exceljs';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, screenshot, signIn, type Session } from './support/browser';

/** Clicks a template link on the import page and gives the file the browser saved, with the name it offered. */
async function download(page: Page, link: string): Promise<{ name: string; bytes: Buffer }> {
  const [file] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: link }).click()]);
  const path = await file.path();
  return { name: file.suggestedFilename(), bytes: readFileSync(path) };
}

/** One CSV line from cells named by header, in the template's column order (RFC 4180 quoting). */
function csvLine(headers: string[], cells: Record<string, string>): string {
  const quote = (text: string) => (/[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text);
  return headers.map((header) => quote(cells[header] ?? '')).join(',');
}

/**
 * A newcomer imports their first ingredients from Crumbproof's own template: the columns and
 * what each means are on the page before any upload, the templates download and open, a filled-in
 * copy is checked row by row (what a good row records, what is wrong with a bad one), and the
 * import button says what it would do, counting only the rows that can be imported.
 */
describe('the ingredient import template, from download to the library, in Chromium', () => {
  let s: Session;
  let work: string;
  let headers: string[] = [];
  beforeAll(async () => {
    work = mkdtempSync(join(tmpdir(), 'crumbproof-import-'));
    s = await openBrowser();
    await signIn(s.page, 'chef@example.com');
  });
  afterAll(async () => {
    await s.close();
    rmSync(work, { recursive: true, force: true });
  });

  it('lists every column with its meaning before any upload, and the CSV and XLSX templates carry those columns', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/ingredients/import`);
    await page.getByRole('heading', { name: 'Import from spreadsheet', level: 1 }).waitFor();
    const columns = page.getByRole('list', { name: 'Columns the import reads' });
    await columns.waitFor();
    const listed = await columns.locator('li').allTextContents();

    const csv = await download(page, 'Template as CSV');
    expect(csv.name).toBe('crumbproof-ingredients-template.csv');
    const text = csv.bytes.toString('utf8');
    expect(text.startsWith('\uFEFF')).toBe(true);
    const lines = text.slice(1).split('\r\n');
    expect(lines.slice(1)).toEqual(['']);
    headers = (lines[0] ?? '').split(',');
    expect(headers.slice(0, 2)).toEqual(['id', 'name']);
    expect(headers).toEqual(expect.arrayContaining(['contains', 'may contain', 'vegan', 'vegetarian', 'fat']));
    // Every column of the template is on the page, each with what it means, in the template's order.
    expect(listed).toHaveLength(headers.length);
    headers.forEach((header, i) => expect(listed[i]).toMatch(new RegExp(`^${header.replace(/[/]/g, '\\/')}( \\(required\\))?: \\S.+`)));
    expect(listed[0]).toMatch(/^id \(required\): /);
    expect(listed.find((line) => line.startsWith('contains:'))).toMatch(/'none' means the supplier states it contains no allergens/);
    await screenshot(page, 'import-guide-1280');

    const xlsx = await download(page, 'Template for Excel (.xlsx)');
    expect(xlsx.name).toBe('crumbproof-ingredients-template.xlsx');
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(xlsx.bytes as unknown as ArrayBuffer);
    expect(book.worksheets.map((sheet) => sheet.name)).toEqual(['Ingredients', 'Columns']);
    const headerRow = book.getWorksheet('Ingredients')!.getRow(1).values as unknown[];
    expect(headerRow.slice(1)).toEqual(headers);
    expect(book.getWorksheet('Ingredients')!.actualRowCount).toBe(1);
    const meanings = book.getWorksheet('Columns')!;
    expect(meanings.getRow(1).values).toEqual([undefined, 'Column', 'Required', 'Meaning']);
    for (const [i, header] of headers.entries()) {
      const [, column, required, meaning] = meanings.getRow(i + 2).values as unknown[];
      expect([column, required]).toEqual([header, i < 2 ? 'yes' : 'no']);
      expect(listed[i]).toContain(String(meaning));
    }
  });

  it('checks a filled-in template row by row, imports only when every row can be, and the new ingredient is in the library with its allergens', async () => {
    const page = s.page;
    const good = {
      id: 'hazelnut-praline-paste',
      name: 'Hazelnut praline paste',
      supplier: 'Ashgrove Confectioners',
      contains: 'hazelnut; milk',
      'may contain': 'almond',
      vegan: 'no',
      vegetarian: 'yes',
      fat: '38,5',
    };
    const unreadable = { id: 'candied-orange', name: 'Candied orange', contains: 'none', vegan: 'yes', vegetarian: 'yes', fat: 'a little' };
    const filled = join(work, 'crumbproof-ingredients-template.csv');
    writeFileSync(filled, `\uFEFF${[headers.join(','), csvLine(headers, good), csvLine(headers, unreadable)].join('\r\n')}\r\n`);

    await page.goto(`${BASE_URL}/ingredients/import`);
    await page.getByLabel('Spreadsheet (CSV or XLSX)').setInputFiles(filled);
    await page.getByRole('button', { name: 'Check the file' }).click();
    const rows = page.getByRole('table', { name: 'Rows of the spreadsheet' });
    await rows.waitFor();
    await page
      .getByRole('status')
      .filter({ hasText: 'crumbproof-ingredients-template.csv: 1 new, 0 revised, 0 unchanged, 1 row with problems (not imported).' })
      .waitFor();

    const row2 = rows.getByRole('row').filter({ hasText: 'Hazelnut praline paste' });
    await row2.getByText('Add new').waitFor();
    expect((await row2.textContent())?.replace(/\s+/g, ' ')).toMatch(
      /Contains:\s*hazelnut, milk\s*May contain:\s*almond\s*Vegan:\s*No\s*Vegetarian:\s*Yes/i,
    );
    const row3 = rows.getByRole('row').filter({ hasText: 'Candied orange' });
    await row3.getByText('Not imported').waitFor();
    await row3.getByText(/row 3, column fat.*'a little' is not a number\./i).waitFor();
    expect(await row3.getByText(/Contains:/).count()).toBe(0);

    // The button counts the one row that can be imported, and imports nothing while a row has a problem.
    const button = page.getByRole('button', { name: /^Nothing is imported while/ });
    expect(await button.textContent()).toBe('Nothing is imported while 1 row has a problem');
    expect(await button.isDisabled()).toBe(true);
    await page.getByText(/check the file again: the other rows would import 1 ingredient: 1 new, 0 revised\./).waitFor();
    await screenshot(page, 'import-template-preview-1280');

    // The newcomer takes the unreadable row out and checks the file again.
    writeFileSync(filled, `\uFEFF${[headers.join(','), csvLine(headers, good)].join('\r\n')}\r\n`);
    await page.getByLabel('Spreadsheet (CSV or XLSX)').setInputFiles(filled);
    await page.getByRole('button', { name: 'Check the file' }).click();
    await page.getByRole('status').filter({ hasText: '1 new, 0 revised, 0 unchanged, 0 rows with problems (not imported).' }).waitFor();
    const ready = page.getByRole('button', { name: 'Import 1 ingredient: 1 new, 0 revised', exact: true });
    expect(await ready.isEnabled()).toBe(true);
    await ready.click();
    await page.getByText('Imported 1 ingredient: 1 added, 0 updated.').waitFor();

    const saved = await page.evaluate(async () => (await fetch('/api/ingredients/hazelnut-praline-paste')).json());
    expect(saved).toMatchObject({
      id: 'hazelnut-praline-paste',
      name: 'Hazelnut praline paste',
      supplier: 'Ashgrove Confectioners',
      contains: ['hazelnut', 'milk'],
      mayContain: ['almond'],
      vegan: false,
      vegetarian: true,
      nutrition: { fat: 38.5 },
      revision: 1,
    });
    const missing = await page.evaluate(async () => (await fetch('/api/ingredients/candied-orange')).status);
    expect(missing).toBe(404);

    await page.getByRole('link', { name: 'See them in the ingredient library' }).click();
    await page.getByLabel('Search ingredients').fill('praline');
    const library = page.getByRole('table', { name: 'Ingredients in the library' });
    const listed = library.getByRole('row').filter({ hasText: 'Hazelnut praline paste' });
    await listed.waitFor();
    expect(await listed.textContent()).toMatch(/hazelnut.*milk/i);
    await listed.getByRole('link', { name: 'Hazelnut praline paste' }).click();
    await page.getByRole('heading', { name: 'Hazelnut praline paste', level: 1 }).waitFor();
    const contains = page.getByRole('group', { name: 'Contains' });
    expect(await contains.getByLabel('hazelnut', { exact: true }).isChecked()).toBe(true);
    expect(await contains.getByLabel('milk', { exact: true }).isChecked()).toBe(true);
    expect(await contains.getByLabel('almond', { exact: true }).isChecked()).toBe(false);
  });
});
