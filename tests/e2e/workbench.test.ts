import AxeBuilder from '@axe-core/playwright';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, screenshot, sellAtBakehouse, signIn, type Session } from './support/browser';
import { pickItem as pick } from './support/recipe-editor';

const FIXTURES = join(new URL('../fixtures', import.meta.url).pathname);

async function axeViolations(page: Page) {
  const result = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa']).analyze();
  return result.violations.map((v) => `${v.id}: ${v.help} (${v.nodes.length})`);
}

describe('the pastry chef’s workbench, in Chromium', () => {
  let s: Session;
  beforeAll(async () => {
    s = await openBrowser();
    await signIn(s.page, 'chef@example.com');
  });
  afterAll(() => s.close());

  it('adds an ingredient with its allergen statement and attaches a specification PDF', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/ingredients/new`);
    await page.getByRole('heading', { name: 'New ingredient', level: 1 }).waitFor();
    await page.getByLabel('Name', { exact: true }).fill('Oat cream alternative');
    await page.getByLabel('Ingredient id').fill('oat-cream');
    await page.getByLabel('Supplier', { exact: true }).fill('Fernhollow Oat Co.');
    await page.getByLabel('Supplier states these allergens').check();
    await page.getByRole('group', { name: 'Contains' }).getByLabel('oats', { exact: true }).check();
    await page.getByRole('group', { name: 'Vegan' }).getByLabel('Yes').check();
    await page.getByRole('group', { name: 'Vegetarian' }).getByLabel('Yes').check();
    await page.getByLabel('Weight per millilitre (g)').fill('1.01');
    await page
      .getByLabel("Composition (supplier's ingredients text)")
      .fill('Water, oats (10%), rapeseed oil, acidity regulator: potassium phosphates, salt');
    await page.getByRole('region', { name: 'Found in the composition' }).getByText('oats', { exact: false }).first().waitFor();
    await screenshot(page, 'ingredient-new-1280');
    await page.getByRole('button', { name: 'Save ingredient' }).click();
    await page.waitForURL(/\/ingredients\/oat-cream$/);
    await page.getByRole('heading', { name: 'Oat cream alternative', level: 1 }).waitFor();

    await page.getByLabel('Specification file').setInputFiles(join(FIXTURES, 'oat-cream-spec.pdf'));
    await page.getByLabel('Review by').fill('2027-06-30');
    await page.getByRole('button', { name: 'Upload specification' }).click();
    const versions = page.getByRole('list', { name: 'Specification versions, newest first' });
    await versions.getByText(/oat-cream-spec\.pdf/).waitFor();
    await page.getByRole('link', { name: 'Open the current specification' }).waitFor();
    await screenshot(page, 'ingredient-with-specification-1280');
  });

  it('builds a sub-recipe and a product, and the live declaration follows each line before saving', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/recipes/new`);
    await page.getByRole('heading', { name: 'New recipe', level: 1 }).waitFor();
    await page.getByLabel('Recipe name').fill('Vanilla cream filling');
    await page.getByLabel('Recipe id').fill('vanilla-cream-filling');
    await pick(page, 'Ingredient or recipe for line 1', 'Double cream');
    await page.getByLabel('Quantity for line 1').fill('200');
    await page.getByLabel('Unit for line 1').selectOption('ml');
    await page.getByRole('button', { name: 'Add line' }).click();
    await pick(page, 'Ingredient or recipe for line 2', 'Caster sugar');
    await page.getByLabel('Quantity for line 2').fill('30');
    const live = page.getByRole('region', { name: 'Live declaration' });
    await live.getByText(/Contains\s*milk/).waitFor();
    await page.getByRole('button', { name: 'Save recipe' }).click();
    await page.waitForURL(/\/recipes\/vanilla-cream-filling$/);
    // The product page's code loads after the address changes: wait for the page itself.
    await page.getByRole('link', { name: 'Edit recipe' }).waitFor();

    await page.goto(`${BASE_URL}/recipes/new`);
    await page.getByLabel('Recipe name').fill('Vanilla cream cup');
    await page.getByLabel('Recipe id').fill('vanilla-cream-cup');
    await pick(page, 'Ingredient or recipe for line 1', 'Vanilla cream filling');
    await page.getByLabel('Quantity for line 1').fill('200');
    await page.getByRole('button', { name: 'Add line' }).click();
    await pick(page, 'Ingredient or recipe for line 2', 'Strawberries');
    await page.getByLabel('Quantity for line 2').fill('100');
    await page.getByLabel('For sale').check();
    await page.getByLabel('Portion (g)').fill('150');
    await page.getByRole('checkbox', { name: 'Vegan', exact: true }).check();
    await live.getByText(/Contains\s*milk/).waitFor();
    // A wanted claim that the recipe breaks is shown before saving.
    await page
      .getByText(/Vegan is wanted but fails/)
      .first()
      .waitFor();
    await screenshot(page, 'recipe-editor-1280');
    await page.getByRole('button', { name: 'Save recipe' }).click();
    await page.waitForURL(/\/recipes\/vanilla-cream-cup$/);
    // The product page's code loads after the address changes: wait for the page itself.
    await page.getByRole('link', { name: 'Edit recipe' }).waitFor();
    await page.getByText('Vegan: Fails').waitFor();
    const contains = page.getByRole('region', { name: 'Contains' });
    await contains.getByRole('link', { name: 'Double cream' }).first().waitFor();
    expect(await axeViolations(page)).toEqual([]);
    await screenshot(page, 'product-page-1280');
  });

  it('runs a swap check that turns the product vegan, applies it and sees the new revision', async () => {
    const page = s.page;
    // The swap check names the products on sale that it reaches: the new cup is put on sale at the bakehouse.
    await sellAtBakehouse('vanilla-cream-cup');
    await page.goto(`${BASE_URL}/recipes/swap`);
    await page.getByRole('heading', { name: 'Swap check', level: 1 }).waitFor();
    await pick(page, 'Replace', 'Double cream');
    await pick(page, 'With', 'Oat cream alternative');
    await page.getByRole('button', { name: 'Check the swap' }).click();
    const result = page.getByRole('region', { name: 'Swap result' });
    await result.getByRole('heading', { name: 'Vanilla cream cup' }).waitFor();
    await result.getByText('Vegan: Fails → Holds').waitFor();
    await result.getByText(/Dairy-free: Fails → /).waitFor();
    await screenshot(page, 'swap-check-1280');
    // Nothing is saved by the check.
    await page.goto(`${BASE_URL}/recipes/vanilla-cream-cup`);
    await page.getByText('Vegan: Fails').waitFor();

    await page.goto(`${BASE_URL}/recipes/swap`);
    await pick(page, 'Replace', 'Double cream');
    await pick(page, 'With', 'Oat cream alternative');
    // Applied to the cup's filling alone, so the demo's own products stay as they are for the other tests.
    await page.getByLabel('Where', { exact: true }).selectOption({ label: 'Vanilla cream filling' });
    await page.getByRole('button', { name: 'Check the swap' }).click();
    await page.getByRole('region', { name: 'Swap result' }).getByRole('heading', { name: 'Vanilla cream cup' }).waitFor();
    await page.getByRole('button', { name: 'Apply swap' }).click();
    await page.getByRole('button', { name: 'Yes, apply to 1 recipe' }).click();
    await page
      .getByText(/Vanilla cream filling.*: revision 2/)
      .first()
      .waitFor();

    await page.goto(`${BASE_URL}/recipes/vanilla-cream-cup`);
    await page.getByText('Vegan: Holds').waitFor();
    await page.goto(`${BASE_URL}/recipes/vanilla-cream-filling`);
    const history = page.getByRole('region', { name: 'Revision history' });
    await history.getByText(/Revision 2/).waitFor();
    await history.getByText(/Swapped Double cream for Oat cream alternative/).waitFor();
    await screenshot(page, 'revision-history-1280');
  });

  it('shows a line that cannot be weighed in place, and saves nothing', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/recipes/vanilla-cream-cup/edit`);
    await page.getByRole('heading', { name: 'Edit Vanilla cream cup', level: 1 }).waitFor();
    await page.getByRole('button', { name: 'Add line' }).click();
    await pick(page, 'Ingredient or recipe for line 3', 'Caster sugar');
    await page.getByLabel('Quantity for line 3').fill('2');
    await page.getByLabel('Unit for line 3').selectOption('each');
    const message = /Line 3 of Vanilla cream cup uses 'caster-sugar' in 'each', but Caster sugar has no weight per unit/;
    await page.locator('[data-line="3"]').getByText(message).waitFor();
    await page.getByRole('button', { name: 'Save recipe' }).click();
    await page.getByRole('alert').filter({ hasText: message }).first().waitFor();
    const saved = await page.evaluate(async () => (await fetch('/api/recipes/vanilla-cream-cup')).json());
    expect(saved.lines).toHaveLength(2);
  });

  it('imports ingredients from a spreadsheet: a sheet with a mistake is refused, a good one is imported whole', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/ingredients/import`);
    await page.getByLabel('Spreadsheet (CSV or XLSX)').setInputFiles(join(FIXTURES, 'ingredients-with-mistakes.csv'));
    await page.getByRole('button', { name: 'Check the file' }).click();
    const rows = page.getByRole('table', { name: 'Rows of the spreadsheet' });
    await rows.getByText(/did you mean 'hazelnut'\?/).waitFor();
    expect(await page.getByRole('button', { name: /^Nothing is imported while \d+ rows? ha(s a problem|ve problems)$/ }).isDisabled()).toBe(
      true,
    );
    // At tablet width every problem is shown whole: wrapped, never cut short.
    await page.setViewportSize({ width: 768, height: 1024 });
    const problem = rows.getByText(/did you mean 'hazelnut'\?/);
    const cut = await problem.evaluate((el) => {
      const style = getComputedStyle(el);
      const box = el.getBoundingClientRect();
      // In view without scrolling sideways: inside the window, not only inside its own cell.
      return {
        ellipsis: style.textOverflow === 'ellipsis',
        hidden: el.scrollWidth > el.clientWidth + 1,
        inView: box.right <= window.innerWidth,
      };
    });
    expect(cut).toEqual({ ellipsis: false, hidden: false, inView: true });
    await screenshot(page, 'import-preview-768');
    await page.setViewportSize({ width: 1280, height: 900 });

    await page.getByLabel('Spreadsheet (CSV or XLSX)').setInputFiles(join(FIXTURES, 'new-ingredients.csv'));
    await page.getByRole('button', { name: 'Check the file' }).click();
    await rows.getByText('pistachio-paste').waitFor();
    await screenshot(page, 'import-preview-1280');
    await page.getByRole('button', { name: 'Import 3 ingredients: 3 new, 0 revised' }).click();
    await page.getByText(/Imported 3 ingredients: 3 added, 0 updated/).waitFor();
    await page.goto(`${BASE_URL}/ingredients/hillfold-oat-drink`);
    await page.getByRole('heading', { name: 'Hillfold oat drink', level: 1 }).waitFor();
  });

  it('refuses a save from a revision someone else has replaced, shows who changed what, and saves over it only when asked', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/ingredients/hillfold-oat-drink`);
    await page.getByRole('heading', { name: 'Hillfold oat drink', level: 1 }).waitFor();
    // The manager saves the oat drink from another browser while the chef has it open.
    const other = await openBrowser();
    try {
      await signIn(other.page, 'manager@example.com');
      const status = await other.page.evaluate(async () => {
        const { revision, updatedAt: _u, ...body } = await (await fetch('/api/ingredients/hillfold-oat-drink')).json();
        const res = await fetch('/api/ingredients/hillfold-oat-drink', {
          method: 'PUT',
          headers: { 'Content-Type': 'application/json' },
          body: JSON.stringify({ ...body, supplierCode: 'HF-OAT-2', baseRevision: revision }),
        });
        return res.status;
      });
      expect(status).toBe(200);
    } finally {
      await other.close();
    }
    await page.getByLabel('Supplier', { exact: true }).fill('Hillfold Dairy-free');
    await page.getByRole('button', { name: 'Save ingredient' }).click();
    const panel = page.getByRole('alert').filter({ hasText: 'Someone else saved this while you were editing' });
    await panel.getByText(/Maren Holloway saved revision 2/).waitFor();
    await panel.getByText('Supplier code: changed from “HF-OAT” to “HF-OAT-2”.').waitFor();
    await screenshot(page, 'stale-save-1280');
    await panel.getByRole('button', { name: 'Save my values over theirs' }).click();
    await page.getByText('Saved. This is revision 3.').waitFor();
    const saved = await page.evaluate(async () => (await fetch('/api/ingredients/hillfold-oat-drink')).json());
    expect(saved).toMatchObject({ revision: 3, supplier: 'Hillfold Dairy-free' });
  });

  it('has no accessibility violations on the workbench pages', async () => {
    for (const path of [
      '/ingredients',
      '/ingredients/oat-cream',
      '/ingredients/import',
      '/recipes',
      '/recipes/vanilla-cream-cup/edit',
      '/recipes/swap',
      '/today',
    ]) {
      await s.page.goto(`${BASE_URL}${path}`);
      await s.page.getByRole('heading', { level: 1 }).waitFor();
      await s.page.waitForLoadState('networkidle');
      expect(await axeViolations(s.page), path).toEqual([]);
    }
  });

  it('reads well at tablet width', async () => {
    await s.page.setViewportSize({ width: 768, height: 1024 });
    for (const [path, name] of [
      ['/recipes/vanilla-cream-cup', 'product-page-768'],
      ['/recipes/vanilla-cream-cup/edit', 'recipe-editor-768'],
      ['/ingredients', 'ingredients-768'],
      ['/recipes/swap', 'swap-check-768'],
      ['/today', 'today-768'],
    ] as const) {
      await s.page.goto(`${BASE_URL}${path}`);
      await s.page.getByRole('heading', { level: 1 }).waitFor();
      await s.page.waitForLoadState('networkidle');
      const overflow = await s.page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      expect(overflow, `${path} scrolls sideways at 768 px`).toBeLessThanOrEqual(0);
      await screenshot(s.page, name);
    }
    await s.page.setViewportSize({ width: 1280, height: 900 });
  });

  it('fits the line table without scrolling it sideways at every width from a small laptop to 1280 px', async () => {
    await s.page.goto(`${BASE_URL}/recipes/vanilla-cream-cup/edit`);
    await s.page.getByRole('heading', { level: 1 }).waitFor();
    for (const width of [1024, 1100, 1200, 1279, 1280]) {
      await s.page.setViewportSize({ width, height: 900 });
      const lines = s.page.getByRole('region', { name: 'Recipe lines' });
      await lines.waitFor();
      const hidden = await lines.evaluate((el) => el.scrollWidth - el.clientWidth);
      expect(hidden, `the line table scrolls sideways at ${width} px`).toBeLessThanOrEqual(0);
      // The live declaration is beside the form from 1280 px, and folded into the summary below that.
      const beside = await s.page.getByRole('heading', { name: 'Live declaration', level: 2 }).isVisible();
      expect(beside, `live declaration beside the form at ${width} px`).toBe(width >= 1280);
    }
    await screenshot(s.page, 'recipe-editor-1280');
  });
});

describe('front of house', () => {
  let s: Session;
  beforeAll(async () => {
    s = await openBrowser();
    await signIn(s.page, 'counter@example.com');
  });
  afterAll(() => s.close());

  it('reads a product’s declaration but cannot reach the editors', async () => {
    await s.page.goto(`${BASE_URL}/recipes/vegan-brownie`);
    await s.page.getByText('Vegan: Holds').waitFor();
    // The demo product's declaration: allergens with their paths, the caution, nutrition in both formats.
    await s.page.getByRole('region', { name: 'Contains' }).getByText('cereals containing gluten').waitFor();
    await s.page
      .getByRole('region', { name: 'May contain' })
      .getByText(/Supplier of Plant-based baking spread: may contain milk/)
      .waitFor();
    await s.page
      .getByText(/Computed from the recipes and supplier information recorded in Crumbproof/)
      .first()
      .waitFor();
    await s.page.getByRole('table', { name: 'Nutrition declaration (EU and UK): as this kitchen prints it' }).waitFor();
    await s.page.getByRole('table', { name: 'Nutrition per serving (70 g), United States' }).waitFor();
    await screenshot(s.page, 'product-page-counter-1280');
    expect(await s.page.getByRole('link', { name: 'Edit recipe' }).count()).toBe(0);
    for (const path of ['/recipes/vegan-brownie/edit', '/recipes/new', '/recipes/swap', '/ingredients/new', '/ingredients/butter']) {
      await s.page.goto(`${BASE_URL}${path}`);
      await s.page.getByRole('heading', { name: 'Not available to your role' }).waitFor();
      expect(await s.page.getByRole('button', { name: /Save/ }).count()).toBe(0);
    }
  });
});
