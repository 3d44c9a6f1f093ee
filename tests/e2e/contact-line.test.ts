import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, screenshot, signIn, type Session } from './support/browser';
import { pickItem } from './support/recipe-editor';

/** The words the form gives a quantity box left empty or unreadable; a contact line must never get them. */
const NUMBER_WANTED = /Give a number|Write a number|Enter a number/;

/** The product page's declaration, once drawn: the Contains item of an allergen, and the ingredient list as printed. */
async function declarationOf(page: Page, name: string) {
  await page.getByRole('heading', { name, level: 1 }).waitFor();
  const contains = page.getByRole('region', { name: 'Contains' });
  await contains.waitFor();
  const item = (allergen: string) => contains.locator('li').filter({ has: page.getByText(allergen, { exact: true }) });
  const printed = (await page.getByTestId('ingredients-text').textContent()) ?? '';
  const mayContain = (await page.getByRole('region', { name: 'May contain' }).textContent()) ?? '';
  return { item, printed, mayContain };
}

/**
 * A contact line (flour dusting the board, butter greasing the tin) has no weight. What it brings
 * is in the food, so it is declared under contains, never moved to may contain (Regulation (EU)
 * No 1169/2011 Art. 9(1)(c) and Art. 21: an ingredient used in the manufacture and still present
 * is declared with its allergen emphasised), and an ingredient also weighed in the mix is named
 * once in the ingredient list, in its place by weight.
 */
describe('a contact line without a weight, in Chromium', () => {
  let s: Session;
  beforeAll(async () => {
    s = await openBrowser();
    await signIn(s.page, 'chef@example.com');
  });
  afterAll(() => s.close());

  it('adds flour dusting the board to a shortbread whose dough already weighs flour: saved without a quantity, declared from contact, listed once', async () => {
    const page = s.page;
    const before = await page.evaluate(async () => (await fetch('/api/recipes/lemon-shortbread')).json());
    expect(before.lines.filter((l: { use: string }) => l.use === 'plain-flour')).toEqual([{ use: 'plain-flour', qty: 300, unit: 'g' }]);

    await page.goto(`${BASE_URL}/recipes/lemon-shortbread/edit`);
    await page.getByRole('heading', { name: 'Edit Chocolate-dipped lemon shortbread', level: 1 }).waitFor();
    await page.getByRole('button', { name: 'Add line' }).click();
    const n = before.lines.length + 1;
    await pickItem(page, `Ingredient or recipe for line ${n}`, 'Plain wheat flour');
    await page.getByLabel(`Role for line ${n}`).selectOption('contact');
    // The line has no quantity box once it is a contact line, and says why.
    await page.locator(`[data-line="${n}"]`).getByText('No weight: brings its allergens only').waitFor();
    expect(await page.getByLabel(`Quantity for line ${n}`).count()).toBe(0);
    // Its words are shown whole, beside the role and never under it.
    const words = page.locator(`[data-line="${n}"]`).getByText('No weight: brings its allergens only');
    const role = page.getByLabel(`Role for line ${n}`);
    const [wordsBox, roleBox] = [await words.boundingBox(), await role.boundingBox()];
    expect(await words.evaluate((el) => el.scrollWidth <= el.clientWidth + 1)).toBe(true);
    expect(wordsBox!.x + wordsBox!.width).toBeLessThanOrEqual(roleBox!.x);
    const live = page.getByRole('region', { name: 'Live declaration' });
    await live.getByText(/From contact with Plain wheat flour/).waitFor();
    await screenshot(page, 'recipe-editor-contact-line-1280');

    await page.getByRole('button', { name: 'Save recipe' }).click();
    await page.waitForURL(/\/recipes\/lemon-shortbread$/);
    // The product page's code loads after the address changes: wait for the page itself.
    await page.getByRole('link', { name: 'Edit recipe' }).waitFor();
    expect(await page.getByText(NUMBER_WANTED).count()).toBe(0);

    const saved = await page.evaluate(async () => (await fetch('/api/recipes/lemon-shortbread')).json());
    expect(saved.lines.filter((l: { use: string }) => l.use === 'plain-flour')).toEqual([
      { use: 'plain-flour', qty: 300, unit: 'g' },
      { use: 'plain-flour', role: 'contact' },
    ]);

    const { item, printed, mayContain } = await declarationOf(page, 'Chocolate-dipped lemon shortbread');
    const gluten = item('cereals containing gluten');
    await gluten.getByText('From contact with Plain wheat flour (a contact line: greasing or dusting)', { exact: false }).waitFor();
    await gluten.getByText(/it is still in the food, so it is declared here, not as a may-contain/).waitFor();
    expect(mayContain).not.toMatch(/gluten|wheat/i);
    // Named once, in its place by weight (the heaviest line), as before the contact line.
    expect(printed.match(/Plain wheat flour/g)).toHaveLength(1);
    expect(printed).toMatch(/^Ingredients: Plain wheat flour/);
    await screenshot(page, 'product-contact-line-1280');
  });

  it('a new product greased with butter only by contact declares milk under contains, from contact, and names the butter once at the end', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/recipes/new`);
    await page.getByRole('heading', { name: 'New recipe', level: 1 }).waitFor();
    await page.getByLabel('Recipe name').fill('Griddle scones');
    await page.getByLabel('Recipe id').fill('griddle-scones');
    const lines: [string, string, string][] = [
      ['Plain wheat flour', '250', 'g'],
      ['Caster sugar', '30', 'g'],
      ['Water', '150', 'ml'],
      ['Fine sea salt', '2', 'g'],
    ];
    for (const [index, [name, qty, unit]] of lines.entries()) {
      if (index > 0) await page.getByRole('button', { name: 'Add line' }).click();
      await pickItem(page, `Ingredient or recipe for line ${index + 1}`, name);
      await page.getByLabel(`Quantity for line ${index + 1}`).fill(qty);
      await page.getByLabel(`Unit for line ${index + 1}`).selectOption(unit);
    }
    // Flour on the board, and butter on the griddle: a quantity typed before the role changed never counts.
    await page.getByRole('button', { name: 'Add line' }).click();
    await pickItem(page, 'Ingredient or recipe for line 5', 'Plain wheat flour');
    await page.getByLabel('Role for line 5').selectOption('contact');
    await page.getByRole('button', { name: 'Add line' }).click();
    await pickItem(page, 'Ingredient or recipe for line 6', 'Unsalted butter');
    await page.getByLabel('Quantity for line 6').fill('5');
    await page.getByLabel('Role for line 6').selectOption('contact');
    await page.getByLabel('For sale').check();
    await page.getByLabel('Portion (g)').fill('60');
    await page.getByRole('button', { name: 'Save recipe' }).click();
    await page.waitForURL(/\/recipes\/griddle-scones$/);
    // The product page's code loads after the address changes: wait for the page itself.
    await page.getByRole('link', { name: 'Edit recipe' }).waitFor();
    expect(await page.getByText(NUMBER_WANTED).count()).toBe(0);

    const saved = await page.evaluate(async () => (await fetch('/api/recipes/griddle-scones')).json());
    expect(saved.lines.slice(4)).toEqual([
      { use: 'plain-flour', role: 'contact' },
      { use: 'butter', role: 'contact' },
    ]);

    const { item, printed, mayContain } = await declarationOf(page, 'Griddle scones');
    await item('milk')
      .getByText(/From contact with Unsalted butter \(a contact line: greasing or dusting\)/)
      .waitFor();
    await item('cereals containing gluten')
      .getByText(/From contact with Plain wheat flour/)
      .waitFor();
    expect(mayContain).not.toMatch(/milk/i);
    // Only the weighed lines make the mix: 250 + 30 + 150 + 2 g.
    await page.getByText(/mix 432 g/).waitFor();
    expect(printed).toBe('Ingredients: Plain wheat flour, Water, Caster sugar, Fine sea salt, Unsalted butter (milk).');
    await page.setViewportSize({ width: 768, height: 1024 });
    await screenshot(page, 'product-contact-line-768');
    await page.setViewportSize({ width: 1280, height: 900 });
  });
});
