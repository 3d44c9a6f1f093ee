import { join } from 'node:path';
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, screenshot, signIn, type Session } from './support/browser';

const FIXTURES = join(new URL('../fixtures', import.meta.url).pathname);
const LOAF = 'Apricot and walnut spelt loaf';

/** The product page's Contains section, once the declaration is on screen. */
async function containsSection(page: Page): Promise<Locator> {
  await page.getByRole('heading', { name: LOAF, level: 1 }).waitFor();
  const contains = page.getByRole('region', { name: 'Contains' });
  await contains.waitFor();
  return contains;
}

/** The allergen names the Contains section shows in bold, read the moment it is drawn (no waiting for a change). */
async function containedNow(page: Page): Promise<string[]> {
  const contains = await containsSection(page);
  return contains.locator('li strong').allTextContents();
}

/** Imports a spreadsheet from the import page and waits for the summary. */
async function importSheet(page: Page, file: string, summary: RegExp) {
  await page.getByLabel('Spreadsheet (CSV or XLSX)').setInputFiles(join(FIXTURES, file));
  await page.getByRole('button', { name: 'Check the file' }).click();
  await page.getByRole('button', { name: 'Import 1 ingredient' }).click();
  await page.getByText(summary).waitFor();
}

/**
 * A pastry chef looks at a product, changes an ingredient below it, and opens the product again
 * at once, moving through the app as anyone would (links and the Back button, no reload): the
 * declaration shown is the one worked out after the change, from the first moment it is shown.
 */
describe('a declaration is never shown from before a change the chef just made, in Chromium', () => {
  let s: Session;
  beforeAll(async () => {
    s = await openBrowser();
    await signIn(s.page, 'chef@example.com');
  });
  afterAll(() => s.close());

  it('after an ingredient is changed to contain milk, the product page opened at once declares milk', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/recipes/apricot-walnut-loaf`);
    expect(await containedNow(page)).not.toContain('milk');

    // From the declaration's own list of what it was worked out from, to the yeast.
    const basis = page.getByRole('note', { name: 'What this declaration was worked out from' });
    await basis.getByText('The revisions it used').click();
    await basis.getByRole('link', { name: 'Dried yeast' }).click();
    await page.getByRole('heading', { name: 'Dried yeast', level: 1 }).waitFor();

    await page.getByLabel('Supplier states these allergens').check();
    await page.getByRole('group', { name: 'Contains' }).getByLabel('milk', { exact: true }).check();
    await page.getByRole('group', { name: 'Vegan' }).getByLabel('No', { exact: true }).check();
    await page.getByRole('button', { name: 'Save ingredient' }).click();
    await page.getByText(/Saved\. This is revision \d+\./).waitFor();

    // Straight back to the product, from where the yeast is used.
    await page.getByRole('complementary', { name: 'About this ingredient' }).getByRole('link', { name: LOAF }).first().click();
    expect(await containedNow(page)).toContain('milk');
    await page.getByText('Vegan: Fails').waitFor();
    await basis.getByText('The revisions it used').click();
    await basis.getByText(/Dried yeast, ingredient: revision 2/).waitFor();
    await screenshot(page, 'product-after-change-1280');

    // Put the yeast back as supplied, for the other tests.
    await basis.getByRole('link', { name: 'Dried yeast' }).click();
    await page.getByLabel('Supplier states no allergens').check();
    await page.getByRole('group', { name: 'Vegan' }).getByLabel('Yes', { exact: true }).check();
    await page.getByRole('button', { name: 'Save ingredient' }).click();
    await page.getByText(/Saved\. This is revision \d+\./).waitFor();
    await page.goBack();
    expect(await containedNow(page)).not.toContain('milk');
  });

  it('after a spreadsheet import adds milk to an ingredient, the product page opened at once declares milk', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/recipes/apricot-walnut-loaf`);
    expect(await containedNow(page)).not.toContain('milk');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Ingredients' }).click();
    await page.getByRole('link', { name: 'Import from spreadsheet' }).click();
    await importSheet(page, 'walnuts-with-milk.csv', /Imported 1 ingredient: 0 added, 1 updated/);

    // Back twice: the import page, the library, then the product as it was left.
    await page.goBack();
    await page.goBack();
    expect(await containedNow(page)).toContain('milk');
    const milk = page
      .getByRole('region', { name: 'Contains' })
      .locator('li')
      .filter({ has: page.getByText('milk', { exact: true }) });
    await milk.getByRole('link', { name: 'Walnut pieces' }).first().waitFor();

    // Put the walnuts back as supplied, and the product follows at once again.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Ingredients' }).click();
    await page.getByRole('link', { name: 'Import from spreadsheet' }).click();
    await importSheet(page, 'walnuts-as-supplied.csv', /Imported 1 ingredient: 0 added, 1 updated/);
    await page.goBack();
    await page.goBack();
    expect(await containedNow(page)).not.toContain('milk');
  });

  it('says on the product page when the declaration was worked out and from which revisions, at desk and tablet width', async () => {
    const page = s.page;
    for (const [width, name] of [
      [1280, 'product-basis-1280'],
      [768, 'product-basis-768'],
    ] as const) {
      await page.setViewportSize({ width, height: width === 1280 ? 900 : 1024 });
      await page.goto(`${BASE_URL}/recipes/apricot-walnut-loaf`);
      const basis = page.getByRole('note', { name: 'What this declaration was worked out from' });
      await basis
        .getByText(
          /^Worked out .+ from revision \d+ of this recipe and 8 ingredients at their current revisions, with version \d+ of the kitchen settings\.$/,
        )
        .waitFor();
      await basis.getByText('The revisions it used').click();
      await basis.getByText(/Walnut pieces, ingredient: revision \d+/).waitFor();
      await page.waitForLoadState('networkidle');
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      expect(overflow, `the product page scrolls sideways at ${width} px`).toBeLessThanOrEqual(0);
      await screenshot(page, name);
    }
    await page.setViewportSize({ width: 1280, height: 900 });
  });
});
