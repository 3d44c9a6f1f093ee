import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, screenshot, signIn, type Session } from './support/browser';

/** The product's row in the counter's results (a button whose name starts with the product's name). */
function row(page: Page, name: string): Locator {
  return page.getByRole('button', { name: new RegExp(`^${name.replace(/[()]/g, '\\$&')}`) });
}

async function pick(page: Page, chip: string) {
  const button = page.getByRole('button', { name: chip, exact: true });
  await button.click();
  await expect.poll(() => button.getAttribute('aria-pressed')).toBe('true');
}

async function openCounter(page: Page) {
  await page.goto(`${BASE_URL}/counter`);
  await page.getByRole('heading', { name: 'Counter', level: 1 }).waitFor();
}

const PANCAKES = 'Blueberry griddle pancakes (plant-based batter)';
const SHORTBREAD = 'Chocolate-dipped lemon shortbread';

/**
 * The demo chain's two counters, each in a browser of its own: Wrenfield Lane Bakehouse handles
 * sesame on shared equipment, Saltmarsh Yard Café keeps it apart and greases its griddle with
 * butter. Each counter answers from its own kitchen's declarations.
 */
describe('the counters of two kitchens over one recipe book, in Chromium', () => {
  let shop: Session;
  let cafe: Session;

  beforeAll(async () => {
    shop = await openBrowser();
    cafe = await openBrowser();
    await signIn(shop.page, 'counter@example.com');
    await signIn(cafe.page, 'cafe@example.com');
  });
  afterAll(async () => {
    await shop?.close();
    await cafe?.close();
  });

  it('front of house at the café sees the griddle pancakes fail vegan, with the reason in words', async () => {
    const page = cafe.page;
    await openCounter(page);
    await pick(page, 'Vegan');
    await expect
      .poll(() => row(page, PANCAKES).textContent())
      .toMatch(/Contains\s*Not vegan: Unsalted butter is recorded as not vegan \(through a contact line: greasing or dusting\)/);
    for (const text of await page.getByRole('main').allTextContents()) expect(text).not.toMatch(/\bsafe\b/i);
    await screenshot(page, 'kitchens-cafe-counter-vegan-1280');
  });

  it('answers the same shared shortbread differently for sesame at the two counters', async () => {
    await openCounter(shop.page);
    await openCounter(cafe.page);
    await pick(shop.page, 'Sesame seeds');
    await pick(cafe.page, 'Sesame seeds');
    await expect
      .poll(() => row(shop.page, SHORTBREAD).textContent())
      .toMatch(/May contain\s*May contain sesame[^.]*made on equipment shared with sesame/);
    await expect
      .poll(() => row(cafe.page, SHORTBREAD).textContent())
      .toMatch(/Suitable as recorded\s*No listed sesame seeds, no may-contain of sesame seeds, as recorded/);
    await screenshot(shop.page, 'kitchens-shop-counter-sesame-1280');
    await screenshot(cafe.page, 'kitchens-cafe-counter-sesame-1280');
  });
});
