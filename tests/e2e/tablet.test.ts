import AxeBuilder from '@axe-core/playwright';
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, screenshot, signIn, type Session } from './support/browser';

const WIDTH = 768;
const HEIGHT = 1024;

/** Where an element sits against the window, without scrolling: inside it top to bottom and left to right. */
async function inWindow(locator: Locator) {
  const box = await locator.boundingBox();
  if (!box) return { shown: false };
  return {
    shown: true,
    top: box.y >= 0,
    bottom: box.y + box.height <= HEIGHT,
    left: box.x >= 0,
    right: box.x + box.width <= WIDTH,
  };
}

const WHOLLY_IN = { shown: true, top: true, bottom: true, left: true, right: true };

/** The header cells of a table that do not fit across the window, or are not shown at all. */
async function headersOutOfView(page: Page, table: string, headers: readonly string[]) {
  const out: string[] = [];
  for (const header of headers) {
    const cell = page.getByRole('table', { name: table }).getByRole('columnheader', { name: header, exact: true });
    const where = await inWindow(cell);
    if (!where.shown || !where.left || !where.right) out.push(header);
  }
  return out;
}

/** A manager on a tablet held upright: the recipe editor, and the columns of the lists that matter. */
describe('the workbench at tablet width, in Chromium', () => {
  let s: Session;
  beforeAll(async () => {
    s = await openBrowser(WIDTH, HEIGHT);
    await signIn(s.page, 'manager@example.com');
  });
  afterAll(() => s.close());

  it('keeps the live declaration’s summary in view while a line is edited, and opens it into the whole declaration', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/recipes/lemon-shortbread/edit`);
    await page.getByRole('heading', { name: 'Edit Chocolate-dipped lemon shortbread', level: 1 }).waitFor();
    const summary = page.getByRole('region', { name: 'Live declaration summary' });
    await summary.getByText('As saved').waitFor();
    await summary.getByText(/Contains:.*milk/).waitFor();
    // The side panel is left out at this width: the summary stands in for it.
    expect(await page.getByRole('region', { name: 'Live declaration', exact: true }).isVisible()).toBe(false);

    // The summary follows an edited line, and is in view without scrolling back up to it.
    await page.getByLabel('Quantity for line 6').fill('3');
    await summary.getByText('Not saved yet').waitFor();
    expect(await inWindow(summary)).toEqual(WHOLLY_IN);
    await summary.getByText(/Claims you want:.*Vegetarian: Holds/).waitFor();

    // Further down the form, the page scrolled to the field, it is still there.
    await page.getByLabel('Weight after baking (g)').fill('650');
    expect(await page.evaluate(() => window.scrollY)).toBeGreaterThan(0);
    expect(await inWindow(summary)).toEqual(WHOLLY_IN);
    await screenshot(page, 'recipe-editor-summary-768');

    const open = summary.getByRole('button', { name: 'Open the full declaration' });
    await open.click();
    const drawer = page.getByRole('dialog', { name: 'The declaration as edited' });
    const full = drawer.getByRole('region', { name: 'Live declaration', exact: true });
    await full.getByText('Not saved yet').waitFor();
    await full
      .getByRole('region', { name: 'Contains' })
      .getByText(/Contains\s*milk/)
      .waitFor();
    await full
      .getByRole('table', { name: /^Nutrition/ })
      .first()
      .waitFor();
    await screenshot(page, 'recipe-editor-drawer-768');
    await page.keyboard.press('Escape');
    await drawer.waitFor({ state: 'hidden' });
    expect(await open.evaluate((button) => button === document.activeElement)).toBe(true);
    const axe = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa']).analyze();
    expect(axe.violations.map((v) => `${v.id}: ${v.help} (${v.nodes.length})`)).toEqual([]);
  });

  it('shows the name, claims and errors of every recipe across the window', async () => {
    await s.page.goto(`${BASE_URL}/recipes`);
    await s.page.getByRole('heading', { name: 'Recipes', level: 1 }).waitFor();
    await s.page
      .getByRole('table', { name: 'Recipes and products' })
      .getByRole('link', { name: 'Chocolate-dipped lemon shortbread' })
      .waitFor();
    expect(await headersOutOfView(s.page, 'Recipes and products', ['Name', 'What the recipe supports', 'Errors'])).toEqual([]);
  });

  it('shows each person’s name, role and access across the window', async () => {
    await s.page.goto(`${BASE_URL}/users`);
    await s.page.getByRole('heading', { name: 'Users', level: 1 }).waitFor();
    const table = 'People who can sign in to this kitchen';
    await s.page.getByRole('table', { name: table }).getByRole('button', { name: 'Deactivate Tobiah Quill' }).waitFor();
    // The role is the one at the kitchen the page's lead names (the demo has two).
    expect(await headersOutOfView(s.page, table, ['Name', 'Role here', 'Active', 'Access'])).toEqual([]);
    expect(await inWindow(s.page.getByRole('button', { name: 'Deactivate Tobiah Quill' }))).toMatchObject({ left: true, right: true });
    // The email folds in under the name rather than going out of view.
    await s.page.getByRole('table', { name: table }).getByText('chef@example.com').first().waitFor();
  });

  it('keeps the whole main navigation on one line', async () => {
    const links = s.page.getByRole('navigation', { name: 'Main' }).getByRole('link');
    const tops = new Set<number>();
    for (const link of await links.all()) tops.add(Math.round((await link.boundingBox())?.y ?? -1));
    expect(await links.count()).toBe(10);
    expect([...tops]).toHaveLength(1);
  });
});
