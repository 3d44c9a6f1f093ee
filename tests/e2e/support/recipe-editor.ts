import type { Page } from 'playwright-core';

/** Types into a recipe line's picker (or the swap check's) and chooses the suggestion with that exact name. */
export async function pickItem(page: Page, label: string, name: string) {
  const box = page.getByLabel(label, { exact: true });
  await box.click();
  await box.fill(name);
  await page
    .getByRole('option', { name: new RegExp(`^${name.replace(/[()]/g, '\\$&')}`) })
    .first()
    .click();
}
