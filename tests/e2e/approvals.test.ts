import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, screenshot, sellAtBakehouse, signIn, type Session } from './support/browser';

const GLAZE = 'approval-glaze';
const BUN = 'approval-glazed-bun';
const BUN_NAME = 'Apricot-glazed bun';

async function seriousViolations(page: Page): Promise<string[]> {
  const axe = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa']).analyze();
  return axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.help}`);
}

/**
 * Change control in Chromium: the pastry chef changes an ingredient so a product gains egg; its
 * labels are refused until the manager, who sees the change in words with what caused it in
 * Approvals, approves it; then they print.
 */
describe('a change that adds egg waits for the manager’s approval before its labels print, in Chromium', () => {
  let chef: Session;
  let manager: Session;
  beforeAll(async () => {
    chef = await openBrowser();
    manager = await openBrowser();
    await signIn(chef.page, 'chef@example.com');
    await signIn(manager.page, 'manager@example.com');
    // A product of its own, so the demo's products stay as they are for the other tests.
    const glaze = await chef.page.request.post(`${BASE_URL}/api/ingredients`, {
      data: {
        id: GLAZE,
        name: 'Apricot glaze',
        supplier: 'Invented Preserves',
        contains: ['milk'],
        mayContain: [],
        composition: 'Apricots, sugar, skimmed milk powder',
        vegan: false,
        vegetarian: true,
      },
    });
    expect(glaze.status(), await glaze.text()).toBe(201);
    const bun = await chef.page.request.post(`${BASE_URL}/api/recipes`, {
      data: {
        id: BUN,
        name: BUN_NAME,
        lines: [
          { use: 'plain-flour', qty: 300, unit: 'g' },
          { use: 'water', qty: 180, unit: 'g' },
          { use: GLAZE, qty: 40, unit: 'g' },
        ],
        sale: { portionG: 70, shelfLifeDays: 2, dateMark: 'best-before' },
      },
    });
    expect(bun.status(), await bun.text()).toBe(201);
    await sellAtBakehouse(BUN);
    // Its first approval, as the manager gives it.
    const list = (await (await manager.page.request.get(`${BASE_URL}/api/approvals`)).json()) as {
      pending: { product: string; inputHash: string }[];
    };
    const first = list.pending.find((p) => p.product === BUN)!;
    const approved = await manager.page.request.post(`${BASE_URL}/api/approvals`, {
      data: { products: [{ product: BUN, inputHash: first.inputHash }] },
    });
    expect(approved.status(), await approved.text()).toBe(201);
  });
  afterAll(async () => {
    await chef.close();
    await manager.close();
  });

  const printBun = async (page: Page) => {
    await page.goto(`${BASE_URL}/labels`);
    await page.getByRole('heading', { name: 'Labels', level: 1 }).waitFor();
    await page.getByLabel('Template').selectOption('product');
    await page.getByLabel(`Labels of ${BUN_NAME}`).fill('4');
    await page.getByRole('button', { name: 'Print', exact: true }).click();
  };

  it('the chef adds egg to the glaze; the labels are refused, naming the product and where to approve it', async () => {
    const page = chef.page;
    await page.goto(`${BASE_URL}/ingredients/${GLAZE}`);
    await page.getByRole('heading', { name: 'Apricot glaze', level: 1 }).waitFor();
    await page.getByRole('group', { name: 'Contains' }).getByLabel('egg', { exact: true }).check();
    await page.getByRole('button', { name: 'Save ingredient' }).click();
    await page
      .getByText(/Saved|revision 2/i)
      .first()
      .waitFor();

    await printBun(page);
    const refusal = page.getByRole('alert').filter({ hasText: 'Nothing was printed' });
    await refusal.waitFor();
    expect(await refusal.textContent()).toContain(
      `${BUN_NAME}'s declaration has changed since it was approved: a manager approves it in Approvals first.`,
    );
    await refusal.getByRole('link', { name: 'Open Approvals' }).waitFor();
    await screenshot(page, 'labels-refused-for-approval-1280');
  });

  it('the manager sees the change in words with its cause and the mark for an added allergen, approves it, and the labels print', async () => {
    const page = manager.page;
    await page.goto(`${BASE_URL}/approvals`);
    await page.getByRole('heading', { name: 'Approvals', level: 1 }).waitFor();
    const card = page.getByRole('article', { name: BUN_NAME });
    await card.waitFor();
    await card.getByText('Now contains eggs.').waitFor();
    await card.getByText('Adds an allergen').waitFor();
    expect(await card.locator('[data-mark="diamond-solid"]').count()).toBe(1);
    expect(await card.textContent()).toMatch(/Tobiah Quill \(Pastry chef\): Revised the ingredient Apricot glaze \(approval-glaze\)/);
    await screenshot(page, 'approvals-waiting-1280');
    await page.setViewportSize({ width: 768, height: 1024 });
    expect(await seriousViolations(page), 'Approvals at 768 px').toEqual([]);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow, 'Approvals scrolls sideways at 768 px').toBeLessThanOrEqual(0);
    await screenshot(page, 'approvals-waiting-768');
    await page.setViewportSize({ width: 1280, height: 900 });
    expect(await seriousViolations(page), 'Approvals at 1280 px').toEqual([]);

    await card.getByRole('button', { name: `Approve ${BUN_NAME}` }).click();
    await page
      .getByRole('status')
      .filter({ hasText: `Approved ${BUN_NAME}.` })
      .waitFor();
    await card.waitFor({ state: 'detached' });
    await screenshot(page, 'approvals-approved-1280');

    await printBun(page);
    const opened = page.getByRole('link', { name: /^Download the PDF of run \d+$/ });
    await opened.waitFor();
  });
});
