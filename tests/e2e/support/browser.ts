import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

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
 * in?" (Wrenfield Lane Bakehouse unless told, the kitchen of the tests written for one). The
 * test's own requests through `page.request` name that kitchen too, as the app's do.
 */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD, kitchen = BAKEHOUSE) {
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel('Email').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  const shell = page.getByRole('navigation', { name: 'Main' });
  const choice = page.getByRole('heading', { name: 'Which kitchen are you working in?' });
  await shell.or(choice).first().waitFor();
  if (!(await choice.isVisible())) return;
  await page.getByRole('button', { name: kitchen }).click();
  await shell.waitFor();
  const me = (await (await page.request.get(`${BASE_URL}/api/me`)).json()) as { kitchens: { id: number; name: string }[] };
  const chosen = me.kitchens.find((k) => k.name === kitchen);
  if (!chosen) throw new Error(`${email} has no role at ${kitchen}.`);
  await page.context().setExtraHTTPHeaders({ [KITCHEN_HEADER]: String(chosen.id) });
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(SCREENS, { recursive: true });
  await page.screenshot({ path: join(SCREENS, `${name}.png`), fullPage: true });
}
