import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import AxeBuilder from '@axe-core/playwright';
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, SCREENS, screenshot, signIn, type Session } from './support/browser';

/** The product's row in the results (a button whose name starts with the product's name). */
function row(page: Page, name: string): Locator {
  return page.getByRole('button', { name: new RegExp(`^${name.replace(/[()]/g, '\\$&')}`) });
}

interface FeedProduct {
  id: string;
  name: string;
  onSale: boolean;
  declaration: {
    contains: { allergen: string }[];
    mayContain: { allergen: string }[];
    unknown: { name: string }[];
  };
}

/** The counter's feed as the API serves it to this browser's session. */
async function feed(page: Page): Promise<FeedProduct[]> {
  const response = await page.request.get(`${BASE_URL}/api/counter/products`);
  expect(response.status()).toBe(200);
  return ((await response.json()) as { products: FeedProduct[] }).products;
}

const has = (p: FeedProduct, group: string) => p.declaration.contains.some((c) => c.allergen === group);
const mayHave = (p: FeedProduct, group: string) => p.declaration.mayContain.some((m) => m.allergen === group);

/** A dialog is drawn over the viewport: the whole page's height would show the backdrop cut short. */
async function viewportShot(page: Page, name: string) {
  mkdirSync(SCREENS, { recursive: true });
  await page.screenshot({ path: join(SCREENS, `${name}.png`) });
}

async function seriousViolations(page: Page): Promise<string[]> {
  const axe = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa']).analyze();
  return axe.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => `${n.target.join(' ')}: ${n.failureSummary ?? ''}`).join('; ')})`);
}

async function pick(page: Page, chip: string) {
  const button = page.getByRole('button', { name: chip, exact: true });
  await button.click();
  await expect.poll(() => button.getAttribute('aria-pressed')).toBe('true');
}

/**
 * Front of house answers a customer avoiding egg and sesame at the counter while the pastry chef
 * works in the kitchen, each in a browser of their own: the counter classifies what the API
 * declares, asks the kitchen and sees the answer arrive, shows a change made in the kitchen within
 * seconds without a reload, and says so when it is not live.
 */
describe('the counter, in Chromium, with the kitchen in a second browser', () => {
  let counter: Session;
  let kitchen: Session;
  let products: FeedProduct[];

  beforeAll(async () => {
    counter = await openBrowser();
    kitchen = await openBrowser();
    await signIn(counter.page, 'counter@example.com');
    await signIn(kitchen.page, 'chef@example.com');
    products = await feed(counter.page);
  });
  afterAll(async () => {
    await counter?.close();
    await kitchen?.close();
  });

  it('classifies the products for egg and sesame as the API declares them, in words', async () => {
    const page = counter.page;
    await page.goto(`${BASE_URL}/counter`);
    await page.getByRole('heading', { name: 'Counter', level: 1 }).waitFor();
    await pick(page, 'Eggs');
    await pick(page, 'Sesame seeds');

    const containing = products.find((p) => has(p, 'eggs') || has(p, 'sesame'));
    const mayContain = products.find(
      (p) => !has(p, 'eggs') && !has(p, 'sesame') && (mayHave(p, 'eggs') || mayHave(p, 'sesame')) && p.declaration.unknown.length === 0,
    );
    expect(containing, 'the demo kitchen has a product with egg or sesame').toBeDefined();
    expect(mayContain, 'the demo kitchen has a product that may contain sesame').toBeDefined();
    await expect.poll(() => row(page, containing!.name).textContent()).toMatch(/Contains\s*Has (egg|sesame) in the /);
    await expect.poll(() => row(page, mayContain!.name).textContent()).toMatch(/May contain\s*May contain (egg|sesame)/);
    for (const text of await page.getByRole('main').allTextContents()) expect(text).not.toMatch(/\bsafe\b/i);
    await screenshot(page, 'counter-look-up-1280');
  });

  it('asks the kitchen from a product card; the chef answers in the other browser and the card shows it without a reload', async () => {
    const page = counter.page;
    const product = products.find((p) => !has(p, 'eggs') && !has(p, 'sesame') && mayHave(p, 'sesame'))!;
    await row(page, product.name).click();
    const card = page.getByRole('dialog', { name: product.name });
    await card.getByRole('note', { name: 'Caution' }).waitFor();
    await viewportShot(page, 'counter-card-1280');
    await card.getByRole('button', { name: 'Ask the kitchen' }).click();
    const form = page.getByRole('dialog', { name: `Ask the kitchen about ${product.name}` });
    await form.getByLabel('Note for the kitchen (optional)').fill('Severe sesame allergy: is the tray shared today?');
    await form.getByRole('button', { name: 'Send to the kitchen' }).click();
    await form.getByText(/^Sent to the kitchen at \d\d:\d\d\.$/).waitFor();
    await form.getByRole('button', { name: 'Back to the product' }).click();
    await card.getByText('Waiting for the kitchen’s answer.').first().waitFor();

    const chef = kitchen.page;
    await chef.goto(`${BASE_URL}/counter/questions`);
    const answer = 'The tray is washed between bakes; sesame was not baked today.';
    const waiting = chef.getByRole('form', { name: `Answer about ${product.name}` }).first();
    await waiting.getByLabel('Answer for the counter').fill(answer);
    await waiting.getByRole('button', { name: 'Send the answer' }).click();
    await screenshot(chef, 'counter-questions-chef-1280');

    // The counter is told by its events stream: no reload, no click.
    await card.getByText(answer).waitFor({ timeout: 5_000 });
    await card.getByRole('button', { name: 'Close the card' }).click();
  });

  it('shows a change the chef makes to an ingredient within 5 s, without a reload', async () => {
    const page = counter.page;
    const brownie = products.find((p) => p.id === 'vegan-brownie');
    expect(brownie && !has(brownie, 'eggs'), 'the demo brownie records no egg').toBe(true);
    await expect.poll(() => row(page, brownie!.name).textContent()).not.toMatch(/Contains\s*Has/);

    const read = await kitchen.page.request.get(`${BASE_URL}/api/ingredients/flaxseed`);
    expect(read.status()).toBe(200);
    const { revision, updatedAt: _updatedAt, ...flaxseed } = (await read.json()) as Record<string, unknown> & { revision: number };
    // Each save names the revision it starts from.
    const put = (body: unknown, baseRevision: number) =>
      kitchen.page.request.put(`${BASE_URL}/api/ingredients/flaxseed`, { data: { ...(body as object), baseRevision } });
    try {
      const changed = await put({ ...flaxseed, contains: ['egg'] }, revision);
      expect(changed.status(), await changed.text()).toBe(200);
      const started = Date.now();
      await expect
        .poll(() => row(page, brownie!.name).textContent(), { timeout: 5_000, interval: 100 })
        .toMatch(/Contains\s*Has egg in the Ground flaxseed/);
      console.log(`counter showed the change ${Date.now() - started} ms after the save answered`);
      await screenshot(page, 'counter-after-push-1280');
    } finally {
      const restored = await put(flaxseed, revision + 1);
      expect(restored.status(), await restored.text()).toBe(200);
    }
    await expect.poll(() => row(page, brownie!.name).textContent(), { timeout: 5_000 }).not.toMatch(/Has egg/);
  });

  it('says it is not live while offline, keeps the answers on screen, and is live again after a fresh read', async () => {
    const page = counter.page;
    const banner = page.getByRole('alert').filter({ hasText: 'Not live since' });
    await counter.context.setOffline(true);
    await banner.waitFor({ timeout: 5_000 });
    expect(await banner.textContent()).toMatch(/^Not live since \d\d:\d\d: showing the data computed at \d\d:\d\d\. Reconnecting…/);
    await expect.poll(() => row(page, 'Dark chocolate brownie (vegan)').isVisible()).toBe(true);
    await screenshot(page, 'counter-offline-1280');
    await counter.context.setOffline(false);
    await banner.waitFor({ state: 'detached', timeout: 15_000 });
    await page.getByText(/^Computed at \d\d:\d\d; live/).waitFor();
  });

  it('has no serious or critical accessibility problem on its views at 1280 and 768 px with reduced motion, and no sideways scroll', async () => {
    const page = counter.page;
    // Asked for less motion, nothing moves or fades (the chips' colours, the rows, the card), so
    // axe reads every colour as it stays.
    await page.emulateMedia({ reducedMotion: 'reduce' });
    for (const width of [1280, 768]) {
      await page.setViewportSize({ width, height: width === 1280 ? 900 : 1024 });
      for (const [path, name] of [
        ['/counter', 'look-up'],
        ['/counter/questions', 'questions'],
        ['/counter/on-sale', 'on-sale'],
      ] as const) {
        await page.goto(`${BASE_URL}${path}`);
        await page.getByRole('navigation', { name: 'Counter views' }).waitFor();
        await page.getByText(/^Computed at \d\d:\d\d/).waitFor();
        if (name === 'look-up') {
          await pick(page, 'Eggs');
          await pick(page, 'Milk');
        }
        await page.locator('[role="status"]', { hasText: 'Loading' }).first().waitFor({ state: 'detached' });
        expect(await seriousViolations(page), `${path} at ${width} px`).toEqual([]);
        const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
        expect(overflow, `${path} scrolls sideways at ${width} px`).toBeLessThanOrEqual(0);
        await screenshot(page, `counter-${name}-${width}`);
        if (name === 'look-up' && width === 768) {
          // Below desk width the choices fold away to bring the results into view.
          await page.getByRole('button', { name: 'Hide the choices' }).click();
          await page.getByText('The customer avoids eggs and milk.').waitFor();
          expect(await page.getByRole('button', { name: 'Mustard', exact: true }).isVisible()).toBe(false);
          await screenshot(page, 'counter-look-up-folded-768');
        }
      }
      // The card, over the results.
      await page.goto(`${BASE_URL}/counter`);
      await pick(page, 'Sesame seeds');
      // A product that has sesame: its card draws where it comes from.
      const seeded = products.find((p) => has(p, 'sesame'))!;
      await row(page, seeded.name).click();
      await page.getByRole('dialog').getByRole('heading', { name: 'Where it comes from' }).waitFor();
      expect(await seriousViolations(page), `the card at ${width} px`).toEqual([]);
      await viewportShot(page, `counter-card-${width}`);
      await page.getByRole('dialog').getByRole('button', { name: 'More detail' }).click();
      await page.getByRole('dialog').getByRole('heading', { name: 'Ingredients as printed' }).waitFor();
      expect(await seriousViolations(page), `the card's detail at ${width} px`).toEqual([]);
      await viewportShot(page, `counter-card-detail-${width}`);
    }
    await page.setViewportSize({ width: 1280, height: 900 });
    await page.emulateMedia({ reducedMotion: null });
  });
});
