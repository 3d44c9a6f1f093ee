import AxeBuilder from '@axe-core/playwright';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, screenshot, signIn, type Session } from './support/browser';

/**
 * An invitation from end to end: the manager invites someone on the Users page, the mail reaches
 * the development inbox that npm test starts (maildev, whose REST API is at MAILDEV_URL), and the
 * link in it opens Choose your password in Chromium; the new password signs in, and the link
 * then says it was used.
 */
const INBOX = process.env.MAILDEV_URL;

interface InboxMail {
  subject: string;
  text: string;
  html: string;
  to: { address: string }[];
  from: { address: string; name: string }[];
}

/** The newest mail in the inbox to `address`, waiting for it up to 20 s. */
async function mailTo(address: string): Promise<InboxMail> {
  if (!INBOX) throw new Error('MAILDEV_URL is not set: npm test starts the development inbox and sets it.');
  const deadline = Date.now() + 20_000;
  while (Date.now() < deadline) {
    const mails = (await (await fetch(`${INBOX}/api/email`)).json()) as InboxMail[];
    const found = mails.filter((m) => m.to.some((t) => t.address === address)).at(-1);
    if (found) return found;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`No mail to ${address} reached the inbox within 20 s.`);
}

describe('a manager invites a user, who chooses a password from the mailed link and signs in', () => {
  let manager: Session;
  let invited: Session;
  const email = `invited-${Date.now()}@example.com`;
  const password = 'Morning-bake-at-5am!';

  beforeAll(async () => {
    manager = await openBrowser();
    invited = await openBrowser(768, 1000);
  });
  afterAll(async () => {
    await manager?.close();
    await invited?.close();
  });

  it('sends the invitation from the Users page', async () => {
    await signIn(manager.page, 'manager@example.com');
    await manager.page.goto(`${BASE_URL}/users`);
    const form = manager.page.getByRole('form', { name: 'Invite a user' });
    await form.getByLabel('Name').fill('Oona Fairweather');
    await form.getByLabel('Email').fill(email);
    await form.getByLabel('Role').selectOption({ label: 'Front of house' });
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await manager.page.getByText(`a link to choose a password is on its way to ${email}.`, { exact: false }).waitFor();
    const row = manager.page.getByRole('row').filter({ hasText: 'Oona Fairweather' });
    await row.getByText('Invited, no password yet').waitFor();
    await screenshot(manager.page, 'users-invited-1280');
  });

  it('opens the mailed link, sets the password and signs in with it', async () => {
    const mail = await mailTo(email);
    expect(mail.subject).toMatch(/^You are invited to .+ on Crumbproof$/);
    expect(mail.from[0]?.name).toMatch(/ via Crumbproof$/);
    expect(mail.text).toContain('Hello Oona Fairweather,');
    expect(mail.html).toContain('Choose your password');
    const link = /(https?:\/\/\S+\/set-password#token=[A-Za-z0-9_-]+)/.exec(mail.text)?.[1] ?? '';
    expect(link).not.toBe('');
    expect(new URL(link).origin).toBe(new URL(BASE_URL).origin);

    const page = invited.page;
    await page.goto(link);
    await page.getByText(`Welcome, Oona Fairweather. Your account is ${email}.`).waitFor();
    expect(new URL(page.url()).hash).toBe('');
    const axe = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa']).analyze();
    expect(axe.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
    await screenshot(page, 'set-password-768');
    await page.setViewportSize({ width: 1280, height: 900 });
    await screenshot(page, 'set-password-1280');
    await page.setViewportSize({ width: 768, height: 1000 });
    await page.getByLabel('New password').fill(password);
    await page.getByRole('button', { name: 'Set my password' }).click();
    await page.getByText(/Your password is set/).waitFor();
    await page.getByRole('link', { name: 'Sign in' }).click();
    await signIn(page, email, password);
    const nav = page.getByRole('navigation', { name: 'Main' });
    expect((await nav.getByRole('link').allTextContents()).map((t) => t.trim())).toEqual(['Counter', 'Recipes']);

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.goto(link);
    await page.getByText('This link has been used already: each link works once.').waitFor();
    await page.getByRole('link', { name: 'Send me a new link' }).waitFor();
    await screenshot(page, 'set-password-used-768');
  });

  it('shows the sent invitation on the manager’s Mail page', async () => {
    await manager.page.goto(`${BASE_URL}/mail`);
    const row = manager.page.getByRole('row').filter({ hasText: email });
    await row.getByText('Sent', { exact: true }).waitFor();
    const axe = await new AxeBuilder({ page: manager.page }).withTags(['wcag2a', 'wcag2aa']).analyze();
    expect(axe.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
    await screenshot(manager.page, 'mail-1280');
    await manager.page.setViewportSize({ width: 768, height: 1000 });
    await screenshot(manager.page, 'mail-768');
  });
});
