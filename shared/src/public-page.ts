import { z } from 'zod';

/**
 * The kitchen's public product page: a page per published product, outside the signed-in app,
 * that a customer opens from the QR code on a counter ticket. Off until the kitchen turns it on.
 */

/** The longest public base address the kitchen can give (the QR code must stay small enough to scan from a ticket). */
export const PUBLIC_BASE_URL_MAX = 120;

/** Where customers reach this installation, e.g. https://menu.example-bakery.co.uk: http(s) only, no query or fragment. */
export const publicBaseUrlSchema = z
  .string({ error: 'Write the address customers reach Crumbproof at, e.g. https://menu.example-bakery.co.uk.' })
  .trim()
  .min(1, 'Write the address customers reach Crumbproof at, e.g. https://menu.example-bakery.co.uk.')
  .max(PUBLIC_BASE_URL_MAX, `Keep the address to ${PUBLIC_BASE_URL_MAX} characters, so its QR code stays small enough to scan.`)
  .superRefine((value, ctx) => {
    let url: URL;
    try {
      url = new URL(value);
    } catch {
      ctx.addIssue({ code: 'custom', input: value, message: 'Write a whole address, starting with https://.' });
      return;
    }
    if (url.protocol !== 'https:' && url.protocol !== 'http:')
      ctx.addIssue({ code: 'custom', input: value, message: 'Use an address starting with https:// (or http://).' });
    else if (url.username || url.password)
      ctx.addIssue({ code: 'custom', input: value, message: 'Leave the user name and password out of the address.' });
    else if (url.search || url.hash || value.includes('?') || value.includes('#'))
      ctx.addIssue({ code: 'custom', input: value, message: 'Leave out anything after ? or #: give the address alone.' });
  })
  .transform((value) => value.replace(/\/+$/, ''));

/** The kitchen's public page settings, as the manager saves them (PUT /api/public-page/settings). */
export const publicPageSettingsSchema = z
  .strictObject({
    enabled: z.boolean({ error: 'Say whether the public product page is on (true or false).' }),
    baseUrl: publicBaseUrlSchema.nullable(),
  })
  .superRefine((settings, ctx) => {
    if (settings.enabled && settings.baseUrl === null)
      ctx.addIssue({
        code: 'custom',
        path: ['baseUrl'],
        input: null,
        message: 'Give the address customers reach Crumbproof at, so the QR codes on tickets can point at it.',
      });
  });
export type PublicPageSettingsInput = z.input<typeof publicPageSettingsSchema>;
export type PublicPageSettings = z.infer<typeof publicPageSettingsSchema>;

/** The settings as the API serves them, with when they were last saved (null: never, so off). */
export interface PublicPageSettingsView extends PublicPageSettings {
  updatedAt: string | null;
  /**
   * The kitchen's part of its pages' addresses where the installation has several kitchens (its id
   * in the recipe book: `/p/<kitchen>/<product>`); null where it has one (`/p/<product>`).
   */
  kitchen: string | null;
}

/** The path of a product's public page under the base address; with several kitchens, the kitchen's too. */
export const publicPagePath = (productId: string, kitchen: string | null = null) =>
  kitchen === null ? `/p/${encodeURIComponent(productId)}` : `/p/${encodeURIComponent(kitchen)}/${encodeURIComponent(productId)}`;

/** The whole address of a product's public page, as its QR code carries it. */
export function publicPageUrl(baseUrl: string, productId: string, kitchen: string | null = null): string {
  return `${baseUrl.replace(/\/+$/, '')}${publicPagePath(productId, kitchen)}`;
}
