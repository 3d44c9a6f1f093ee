import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, screenshot, signIn, type Session } from './support/browser';

const BROWNIE = 'Dark chocolate brownie (vegan)';

/**
 * The manager's morning: a run of case labels previewed in the browser (the shared renderer and
 * pdfmake's browser build), printed through the API, and found again in the print log by its
 * batch code, with the PDF exactly as printed.
 */
describe('case labels previewed, printed and found in the log, in Chromium', () => {
  let s: Session;
  beforeAll(async () => {
    s = await openBrowser();
    await signIn(s.page, 'manager@example.com');
  });
  afterAll(() => s.close());

  it('previews three trade-item case labels, prints them, and finds the run by its batch with its PDF', async () => {
    const page = s.page;
    const refusedByPolicy: string[] = [];
    page.on('console', (m) => {
      if (/Content Security Policy/i.test(m.text())) refusedByPolicy.push(m.text());
    });
    await page.goto(`${BASE_URL}/labels`);
    await page.getByRole('heading', { name: 'Labels', level: 1 }).waitFor();
    await page.getByLabel('Template').selectOption('case');
    await page.getByLabel(`Cases of ${BROWNIE}`).fill('3');
    await page.getByLabel('Trade-item cases').check();

    await page.getByRole('button', { name: 'Preview' }).click();
    const frame = page.locator('iframe[title="Preview of the labels"]');
    await frame.waitFor({ timeout: 60_000 });
    await page.getByText('3 labels, as they will print.').waitFor();
    // The preview is a PDF drawn in this browser, shown from memory (a blob: address), not fetched from the server.
    expect(await frame.getAttribute('src')).toMatch(/^blob:/);
    // …and the page's security policy lets it be shown (frame-src blob:).
    expect(refusedByPolicy).toEqual([]);
    await page.waitForTimeout(2500);
    await screenshot(page, 'labels-preview-1280');

    await page.getByRole('button', { name: 'Print', exact: true }).click();
    const opened = page.getByRole('link', { name: /^Download the PDF of run \d+$/ });
    await opened.waitFor();
    const runId = Number(/run (\d+)$/.exec((await opened.textContent()) ?? '')?.[1]);
    expect(runId).toBeGreaterThan(0);

    // The print log shows the run at once, newest first, with its batch and its PDF.
    const log = page.getByRole('region', { name: 'Print log, newest first' });
    const row = log.getByRole('row').filter({ has: page.getByRole('link', { name: `PDF of run ${runId}` }) });
    await row.waitFor();
    expect(await row.getByText(BROWNIE).count()).toBe(1);
    const details = (await row.getByText(/^batch /).textContent()) ?? '';
    const batch = /^batch (\S+)/.exec(details)?.[1] ?? '';
    expect(batch).toMatch(/^\d{6}-VEGANB-\d+$/);
    expect(details).toMatch(/best before/);

    // A recall: the log searched by that batch finds this run.
    const searched = page.waitForResponse((r) => r.url().includes(`/api/labels/runs?batch=${encodeURIComponent(batch)}`));
    await page.getByRole('region', { name: 'Print log', exact: true }).getByLabel('Batch code').fill(batch);
    await searched;
    // A batch code is unique per product and day: the search finds this one run.
    await page.getByText('1 run', { exact: true }).waitFor();
    await page.getByText('Searching the log…').waitFor({ state: 'detached' });
    await log.getByRole('link', { name: `PDF of run ${runId}` }).waitFor();
    await screenshot(page, 'labels-log-1280');

    // The PDF of the log is the one printed: a PDF, stored and served as it was made.
    const pdf = await page.request.get(`${BASE_URL}/api/labels/runs/${runId}/pdf`);
    expect(pdf.status()).toBe(200);
    expect(pdf.headers()['content-type']).toContain('application/pdf');
    const body = await pdf.body();
    expect(body.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const runs = await page.request.get(`${BASE_URL}/api/labels/runs?batch=${encodeURIComponent(batch)}`);
    const logged = ((await runs.json()) as { id: number; sha256: string; pdfBytes: number }[]).find((r) => r.id === runId);
    expect(logged?.pdfBytes).toBe(body.length);
    expect(logged?.sha256).toBe(createHash('sha256').update(body).digest('hex'));
  });

  it('previews shipment labels with an SSCC per case, from the kitchen’s GS1 company prefix', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/labels`);
    await page.getByLabel('Template').selectOption('case');
    await page.getByLabel(`Cases of ${BROWNIE}`).fill('2');
    await page.getByLabel('Shipment units (SSCC)').check();
    await page.getByRole('button', { name: 'Preview' }).click();
    await page.getByText('2 labels, as they will print.').waitFor({ timeout: 60_000 });
    await page.getByText(/SSCCs show serials from 0/).waitFor();
  });

  it('shows a product’s print details in the recipe editor, the GTIN’s check digit confirmed', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/recipes/vegan-brownie/edit`);
    await page.getByLabel('GTIN of one unit').waitFor();
    expect(await page.getByLabel('Date mark').inputValue()).toBe('best-before');
    await page.getByText(/^GTIN-13: the check digit \d is right\.$/).waitFor();
    await page.getByRole('group', { name: 'Print details' }).scrollIntoViewIfNeeded();
    await screenshot(page, 'recipe-print-details-1280');
  });

  it('the kitchen page shows the label settings with an example batch code', async () => {
    const page = s.page;
    await page.goto(`${BASE_URL}/kitchen`);
    const form = page.getByRole('form', { name: 'Label settings' });
    await form.waitFor();
    expect(await form.getByLabel('GS1 company prefix').inputValue()).toBe('9521234');
    await form.getByText(/^A run made today of a product with the id lemon-tart gets \d{6}-LEMONT-1\./).waitFor();
    await form.scrollIntoViewIfNeeded();
    await screenshot(page, 'kitchen-labels-1280');
  });

  it('reads well at tablet width, the preview included', async () => {
    const page = s.page;
    await page.setViewportSize({ width: 768, height: 1024 });
    await page.goto(`${BASE_URL}/labels`);
    await page.getByLabel('Template').selectOption('case');
    await page.getByLabel(`Cases of ${BROWNIE}`).fill('2');
    await page.getByRole('button', { name: 'Preview' }).click();
    await page.getByText('2 labels, as they will print.').waitFor({ timeout: 60_000 });
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await page.waitForTimeout(2500);
    await screenshot(page, 'labels-768');
  });
});
