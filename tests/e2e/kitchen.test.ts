import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, screenshot, signIn, type Session } from './support/browser';

describe('kitchen settings, in Chromium', () => {
  let s: Session;
  beforeAll(async () => {
    s = await openBrowser();
    await signIn(s.page, 'manager@example.com');
  });
  afterAll(() => s.close());

  it('the manager adds an allergen handled in a shared area, and products show the may-contain it brings', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/recipes/vegan-brownie`);
    await page.getByText('Vegan: Holds').waitFor();
    expect(await page.getByRole('region', { name: 'May contain' }).getByText('lupin').count()).toBe(0);

    await page.goto(`${BASE_URL}/kitchen`);
    await page.getByRole('heading', { name: 'Kitchen', level: 1 }).waitFor();
    await page.getByRole('button', { name: 'Add an allergen source' }).click();
    const rows = await page.getByRole('combobox', { name: /^Allergen source \d+$/ }).count();
    await page.getByLabel(`Allergen source ${rows}`, { exact: true }).selectOption('lupin');
    await page.getByLabel(`How source ${rows} is handled`).selectOption('shared-area');
    await screenshot(page, 'kitchen-1280');
    await page.getByRole('button', { name: 'Save kitchen settings' }).click();
    await page.getByText(/Every product’s declaration now follows these settings/).waitFor();

    await page.goto(`${BASE_URL}/recipes/vegan-brownie`);
    await page
      .getByRole('region', { name: 'May contain' })
      .getByText(/Lupin: handled in the same area of this kitchen/)
      .waitFor();

    // Put the kitchen back as it was for the other tests.
    await page.goto(`${BASE_URL}/kitchen`);
    await page.getByRole('button', { name: `Remove allergen source ${rows}` }).click();
    await page.getByRole('button', { name: 'Save kitchen settings' }).click();
    await page.getByText(/Every product’s declaration now follows these settings/).waitFor();
  });

  it('reads well at tablet width', async () => {
    await s.page.setViewportSize({ width: 768, height: 1024 });
    await s.page.goto(`${BASE_URL}/kitchen`);
    await s.page.getByRole('button', { name: 'Save kitchen settings' }).waitFor();
    const overflow = await s.page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(s.page, 'kitchen-768');
  });
});
