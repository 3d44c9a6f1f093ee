import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, screenshot, signIn, type Session } from './support/browser';

const PRODUCT = 'vegan-brownie';
/** The demo has two kitchens: a page's address names the kitchen (its id in the recipe book). */
const PAGES = `${BASE_URL}/p/wrenfield-lane`;

/** Serious and critical accessibility findings of the page as it is. */
async function seriousFindings(page: Page): Promise<string[]> {
  const axe = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa']).analyze();
  return axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.help}`);
}

describe('the public product page, in Chromium', () => {
  let manager: Session;
  beforeAll(async () => {
    manager = await openBrowser();
    await signIn(manager.page, 'manager@example.com');
  });
  afterAll(() => manager.close());

  /** The editor's published box for the product, ticked or not, then saved. */
  async function setPublished(published: boolean) {
    const page = manager.page;
    await page.goto(`${BASE_URL}/recipes/${PRODUCT}/edit`);
    const box = page.getByRole('checkbox', { name: /Published on the public page/ });
    await box.waitFor();
    await box.setChecked(published);
    await page.getByRole('button', { name: 'Save recipe' }).click();
    await page.waitForURL(`${BASE_URL}/recipes/${PRODUCT}`);
    // The product page's code loads after the address changes: wait for the page itself.
    await page.getByRole('link', { name: 'Edit recipe' }).waitFor();
  }

  async function setPage(on: boolean) {
    const page = manager.page;
    await page.goto(`${BASE_URL}/kitchen`);
    const form = page.getByRole('form', { name: 'Public product page' });
    await form.getByRole('checkbox', { name: 'Turn on the public product page' }).setChecked(on);
    await form.getByLabel('Address customers reach Crumbproof at').fill(BASE_URL);
    await form.getByRole('button', { name: 'Save public page settings' }).click();
    await form.getByText(/^Saved\./).waitFor();
  }

  it('the manager turns the page on and publishes a product; anyone then reads it on a phone without signing in', async () => {
    await setPage(true);
    await manager.page.setViewportSize({ width: 768, height: 1024 });
    await screenshot(manager.page, 'public-page-settings-768');
    await manager.page.setViewportSize({ width: 1280, height: 900 });
    await setPublished(true);

    const declaration = await (await manager.context.request.get(`${BASE_URL}/api/recipes/${PRODUCT}/declaration`)).json();
    for (const width of [390, 768]) {
      const visitor = await openBrowser(width, width === 390 ? 844 : 1024);
      try {
        const problems: string[] = [];
        visitor.page.on('console', (m) => {
          if (m.type() === 'error') problems.push(m.text());
        });
        visitor.page.on('pageerror', (e) => problems.push(e.message));
        const response = await visitor.page.goto(`${PAGES}/${PRODUCT}`);
        expect(response?.status()).toBe(200);
        await visitor.page.getByRole('heading', { level: 1, name: declaration.name }).waitFor();
        expect(await visitor.page.locator('script').count()).toBe(0);
        await visitor.page.evaluate(() => document.fonts.ready);
        expect(await visitor.page.evaluate(() => document.fonts.check('700 20px "Atkinson Hyperlegible"'))).toBe(true);
        expect(await visitor.page.evaluate(() => getComputedStyle(document.body).fontSize)).toBe('20px');
        const overflow = await visitor.page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
        expect(overflow).toBeLessThanOrEqual(0);
        expect(await seriousFindings(visitor.page)).toEqual([]);
        expect(problems).toEqual([]);
        await screenshot(visitor.page, `public-page-${width}`);

        const missing = await visitor.page.goto(`${PAGES}/no-such-cake`);
        expect(missing?.status()).toBe(404);
        await visitor.page.getByRole('heading', { level: 1, name: 'No product page here' }).waitFor();
        if (width === 390) await screenshot(visitor.page, 'public-page-missing-390');
      } finally {
        await visitor.close();
      }
    }
  });

  it('shows nothing once the product is no longer published, and puts the kitchen back as it was', async () => {
    await setPublished(false);
    const visitor = await openBrowser(390, 844);
    try {
      const response = await visitor.page.goto(`${PAGES}/${PRODUCT}`);
      expect(response?.status()).toBe(404);
    } finally {
      await visitor.close();
    }
    await setPage(false);
  });
});
