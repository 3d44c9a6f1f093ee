import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, request, type BrowserContext, type Page } from 'playwright-core';

export const BASE_URL = process.env.CRUMBPROOF_URL ?? 'http://127.0.0.1:3000';
export const SCREENS = join(new URL('../..', import.meta.url).pathname, 'artifacts', 'screens');
export const DEMO_PASSWORD = 'crumbproof-demo';

export interface Session {
  context: BrowserContext;
  page: Page;
  close(): Promise<void>;
}

/** Debian's chromium, headless, with a fresh profile; no downloads, no background traffic. */
export async function openBrowser(width = 1280, height = 900): Promise<Session> {
  const profile = mkdtempSync(join(tmpdir(), 'crumbproof-pw-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width, height },
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** The demo's kitchens (api/src/database/seeders/demo-chain-book.json), as the app names them. */
export const BAKEHOUSE = 'Wrenfield Lane Bakehouse';
export const CAFE = 'Saltmarsh Yard Café';
/** The kitchen and role HTTP header (shared KITCHEN_HEADER). */
const KITCHEN_HEADER = 'x-crumbproof-kitchen';

/**
 * Signs in; a person of several kitchens then chooses `kitchen` on "Which kitchen are you working
 * in?" (Wrenfield Lane Bakehouse unless told, the kitchen of the tests written for one kitchen).
 * The test's own requests through `page.request` name that kitchen too, as the app's do. Where the
 * app asks no question (a build from before the kitchen choice), the kitchen is named on every
 * request of the browser and the page read again, so the tests written for one kitchen still run.
 */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD, kitchen = BAKEHOUSE) {
  // A kitchen named for an earlier sign-in in this browser may not be this person's.
  await page.context().setExtraHTTPHeaders({});
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel('Email').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  const shell = page.getByRole('navigation', { name: 'Main' });
  const choice = page.getByRole('heading', { name: 'Which kitchen are you working in?' });
  await shell.or(choice).first().waitFor();
  const asked = await choice.isVisible();
  if (asked) {
    await page.getByRole('button', { name: kitchen }).click();
    await shell.waitFor();
  }
  const me = (await (await page.request.get(`${BASE_URL}/api/me`)).json()) as { kitchens: { id: number; name: string }[] };
  if (me.kitchens.length < 2) return;
  const chosen = me.kitchens.find((k) => k.name === kitchen);
  if (!chosen) throw new Error(`${email} has no role at ${kitchen}.`);
  await page.context().setExtraHTTPHeaders({ [KITCHEN_HEADER]: String(chosen.id) });
  if (asked) return;
  await page.reload();
  await shell.waitFor();
  await page.waitForLoadState('networkidle');
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(SCREENS, { recursive: true });
  await page.screenshot({ path: join(SCREENS, `${name}.png`), fullPage: true });
}

/**
 * Puts a product a test made on sale at Wrenfield Lane Bakehouse too. Each demo kitchen sells the
 * products its list names (`sells` in the recipe book), so a new product for sale is sold at
 * neither until a manager adds it to a kitchen's list: this imports the book as it stands with the
 * product added to the bakehouse's, as the demo manager.
 */
export async function sellAtBakehouse(product: string) {
  const api = await request.newContext({ baseURL: BASE_URL });
  try {
    const signedIn = await api.post('/api/auth/sign-in', { data: { email: 'manager@example.com', password: DEMO_PASSWORD } });
    if (!signedIn.ok()) throw new Error(`The demo manager could not sign in: ${signedIn.status()}`);
    const me = (await (await api.get('/api/me')).json()) as { kitchens: { id: number; code: string | null }[] };
    const at = { [KITCHEN_HEADER]: String(me.kitchens.find((k) => k.code === 'wrenfield-lane')!.id) };
    const book = (await (await api.get('/api/book', { headers: at })).json()) as { sites: { id: string; sells?: string[] }[] };
    const bakehouse = book.sites.find((site) => site.id === 'wrenfield-lane')!;
    if (!bakehouse.sells || bakehouse.sells.includes(product)) return;
    bakehouse.sells.push(product);
    const imported = await api.post('/api/book/import', { headers: at, data: book });
    if (!imported.ok())
      throw new Error(`The bakehouse could not be given ${product} to sell: ${imported.status()} ${await imported.text()}`);
  } finally {
    await api.dispose();
  }
}
