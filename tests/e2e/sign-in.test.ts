import AxeBuilder from '@axe-core/playwright';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, screenshot, signIn, type Session } from './support/browser';

const NAV: Record<string, string[]> = {
  'manager@example.com': ['Ingredients', 'Today', 'Recipes', 'Counter', 'Labels', 'Approvals', 'Audit', 'Kitchen', 'Users', 'Mail'],
  'chef@example.com': ['Ingredients', 'Today', 'Recipes', 'Counter', 'Labels', 'Approvals'],
  'counter@example.com': ['Counter', 'Recipes'],
};

describe('signing in, by role, in Chromium', () => {
  let s: Session;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(() => s.close());

  it('sends a visitor who is not signed in to the sign-in page, which has no accessibility violations', async () => {
    await s.page.goto(`${BASE_URL}/recipes`);
    await s.page.waitForURL(/\/sign-in/);
    await expect(s.page.getByRole('heading', { level: 1 }).textContent()).resolves.toMatch(/Sign in/);
    const axe = await new AxeBuilder({ page: s.page }).withTags(['wcag2a', 'wcag2aa']).analyze();
    expect(axe.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
    await screenshot(s.page, 'sign-in-1280');
  });

  it('shows a plain message for a wrong password', async () => {
    await s.page.goto(`${BASE_URL}/sign-in`);
    await s.page.getByLabel('Email').fill('chef@example.com');
    await s.page.getByLabel('Password').fill('wrong-password');
    await s.page.getByRole('button', { name: 'Sign in' }).click();
    await expect(s.page.getByRole('alert').filter({ hasText: 'Email or password is not right.' }).waitFor()).resolves.toBeUndefined();
  });

  for (const [email, links] of Object.entries(NAV)) {
    it(`${email} sees exactly the navigation of that role, then signs out`, async () => {
      await signIn(s.page, email);
      const nav = s.page.getByRole('navigation', { name: 'Main' });
      const names = (await nav.getByRole('link').allTextContents()).map((t) => t.trim());
      expect(names).toEqual(links);
      await screenshot(s.page, `home-${email.split('@')[0]}-1280`);
      await s.page.getByRole('button', { name: 'Sign out' }).click();
      await s.page.waitForURL(/\/sign-in/);
      await s.page.goto(`${BASE_URL}/users`);
      await s.page.waitForURL(/\/sign-in/);
    });
  }

  it('front-of-house is refused the users and ingredients pages', async () => {
    await signIn(s.page, 'counter@example.com');
    for (const path of ['/users', '/ingredients']) {
      await s.page.goto(`${BASE_URL}${path}`);
      await s.page.getByRole('heading', { name: 'Not available to your role' }).waitFor();
      expect(await s.page.getByRole('table').count()).toBe(0);
    }
    await screenshot(s.page, 'refused-counter-1280');
    await s.page.getByRole('button', { name: 'Sign out' }).click();
  });

  it('shows a not-found page for an unknown address', async () => {
    await signIn(s.page, 'manager@example.com');
    await s.page.goto(`${BASE_URL}/no-such-page`);
    await s.page.getByRole('heading', { name: 'Page not found' }).waitFor();
    await s.page.getByRole('button', { name: 'Sign out' }).click();
  });
});

describe('at tablet width (768 px)', () => {
  let s: Session;
  beforeAll(async () => {
    s = await openBrowser(768, 1024);
  });
  afterAll(() => s.close());

  it('signs in and reaches every page of the manager’s navigation', async () => {
    await signIn(s.page, 'manager@example.com');
    await screenshot(s.page, 'home-manager-768');
    await s.page.goto(`${BASE_URL}/users`);
    await s.page.getByRole('heading', { name: 'Users', level: 1 }).waitFor();
    const axe = await new AxeBuilder({ page: s.page }).withTags(['wcag2a', 'wcag2aa']).analyze();
    expect(axe.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
    await screenshot(s.page, 'users-768');
  });
});
