import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, signIn, type Session } from './support/browser';
import { recordScripts, totalKb } from './support/scripts-loaded';

/**
 * What each page makes the browser download. The editors and the label renderer are the app's
 * heaviest code; the sign-in page and the counter (a tablet at the till) must not wait for them.
 */
const WORKBENCH_ONLY =
  /^(page-(recipes-recipe-editor|labels|ingredients|swaps|kitchen|users|audit|approvals|mail)-|label-renderer-|render-preview-)/;

describe('what the first pages download, in Chromium', () => {
  let s: Session;
  beforeEach(async () => {
    s = await openBrowser();
  });
  afterEach(() => s.close());

  it('loads under 200 KB of gzipped JavaScript at the sign-in page, and no workbench code', async () => {
    const scripts = recordScripts(s.page);
    await s.page.goto(`${BASE_URL}/sign-in`);
    await s.page.getByRole('button', { name: 'Sign in' }).waitFor();
    const loaded = await scripts.take();
    expect(loaded.length).toBeGreaterThan(0);
    expect(loaded.map((l) => l.file).filter((f) => WORKBENCH_ONLY.test(f))).toEqual([]);
    expect(totalKb(loaded)).toBeLessThan(200);
  });

  it('opens the counter, front of house’s first page, without the editors or the label renderer', async () => {
    const scripts = recordScripts(s.page);
    await signIn(s.page, 'counter@example.com');
    await s.page.getByRole('heading', { name: 'Counter', level: 1 }).waitFor();
    const atCounter = await scripts.take();
    expect(atCounter.map((l) => l.file).filter((f) => WORKBENCH_ONLY.test(f))).toEqual([]);
  });

  it('loads the recipe editor’s code when the editor is opened', async () => {
    await signIn(s.page, 'chef@example.com');
    const scripts = recordScripts(s.page);
    await s.page.goto(`${BASE_URL}/recipes/lemon-shortbread/edit`);
    await s.page.getByRole('heading', { level: 1 }).waitFor();
    const loaded = await scripts.take();
    expect(loaded.map((l) => l.file).some((f) => f.startsWith('page-recipes-recipe-editor-'))).toBe(true);
  });
});
