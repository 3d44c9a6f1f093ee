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

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel('Email').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('navigation', { name: 'Main' }).waitFor();
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(SCREENS, { recursive: true });
  await page.screenshot({ path: join(SCREENS, `${name}.png`), fullPage: true });
}
