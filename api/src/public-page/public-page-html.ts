import type { ReadAloud } from '@crumbproof/shared';

/** A page of the public product page, ready to send: its status and the whole HTML document. */
export interface PublicPage {
  status: 200 | 404 | 429;
  html: string;
}

/** The shipped font's files, served by the page itself (GET /p/fonts/:file), with the characters each covers. */
export const PAGE_FONTS = {
  'atkinson-hyperlegible-latin-400.woff2': { source: 'atkinson-hyperlegible-latin-400-normal.woff2', weight: 400, subset: 'latin' },
  'atkinson-hyperlegible-latin-700.woff2': { source: 'atkinson-hyperlegible-latin-700-normal.woff2', weight: 700, subset: 'latin' },
  'atkinson-hyperlegible-latin-ext-400.woff2': {
    source: 'atkinson-hyperlegible-latin-ext-400-normal.woff2',
    weight: 400,
    subset: 'latin-ext',
  },
  'atkinson-hyperlegible-latin-ext-700.woff2': {
    source: 'atkinson-hyperlegible-latin-ext-700-normal.woff2',
    weight: 700,
    subset: 'latin-ext',
  },
} as const;
export type PageFont = keyof typeof PAGE_FONTS;

/** The unicode ranges of @fontsource/atkinson-hyperlegible's subsets, as its own CSS gives them. */
const RANGES = {
  latin:
    'U+0000-00FF,U+0131,U+0152-0153,U+02BB-02BC,U+02C6,U+02DA,U+02DC,U+0304,U+0308,U+0329,U+2000-206F,U+20AC,U+2122,U+2191,U+2193,U+2212,U+2215,U+FEFF,U+FFFD',
  'latin-ext':
    'U+0100-02BA,U+02BD-02C5,U+02C7-02CC,U+02CE-02D7,U+02DD-02FF,U+0304,U+0308,U+0329,U+1D00-1DBF,U+1E00-1E9F,U+1EF2-1EFF,U+2020,U+20A0-20AB,U+20AD-20C0,U+2113,U+2C60-2C7F,U+A720-A7FF',
} as const;

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
/** Text as HTML shows it: every character that could open markup written as an entity. */
export const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => ESCAPES[c]);

const fontFaces = Object.entries(PAGE_FONTS)
  .map(
    ([file, f]) =>
      `@font-face{font-family:'Atkinson Hyperlegible';font-style:normal;font-display:swap;font-weight:${f.weight};src:url(/p/fonts/${file}) format('woff2');unicode-range:${RANGES[f.subset]}}`,
  )
  .join('');

/**
 * The page's look: Crumbproof's warm paper and dark ink (the web app's theme, WCAG AA: ink on
 * paper 15.6:1, muted ink 7.9:1), Atkinson Hyperlegible at 20 px and up, one column a phone
 * reads without zooming. Inline, which the app's Content-Security-Policy allows for styles; the
 * page carries no script at all.
 */
const STYLE = `${fontFaces}
*{box-sizing:border-box}
html{-webkit-text-size-adjust:100%;text-size-adjust:100%}
body{margin:0;background:#FAF5EC;color:#231B14;font-family:'Atkinson Hyperlegible',ui-sans-serif,system-ui,sans-serif;font-size:1.25rem;line-height:1.5}
main{max-width:40rem;margin:0 auto;padding:1.25rem 1rem 2.5rem}
.kitchen{margin:0 0 .25rem;color:#574A3E;font-size:1.125rem}
h1{margin:0 0 1rem;font-size:2rem;line-height:1.2}
h2{margin:0 0 .5rem;font-size:1.25rem}
.lead{margin:0 0 1.25rem;font-size:1.375rem;font-weight:700}
section{margin:0 0 1.25rem}
ul{margin:0;padding-left:1.25rem}
li{margin:0 0 .5rem}
p{margin:0 0 .75rem}
.caution{margin:1.5rem 0;padding:1rem;background:#FFFDF8;border:1px solid #8A7862;border-left:.375rem solid #5E2750;border-radius:.375rem}
.caution p{margin:0}
.basis{color:#574A3E;font-size:1.125rem}
`;

function document(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="referrer" content="no-referrer">
<title>${escapeHtml(title)}</title>
<style>${STYLE}</style>
</head>
<body>
<main>
${body}
</main>
</body>
</html>
`;
}

const list = (items: readonly string[]) => `<ul>${items.map((s) => `<li>${escapeHtml(s)}</li>`).join('')}</ul>`;

function section(title: string, items: readonly string[]): string {
  return items.length === 0 ? '' : `<section><h2>${escapeHtml(title)}</h2>${list(items)}</section>`;
}

const dayFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

export interface ProductPageInput {
  kitchen: string;
  product: string;
  /** When the declaration was worked out (ISO 8601). */
  computedAt: string;
  /** The engine could not declare the product in full: nothing is said of its allergens but that. */
  incomplete: boolean;
  said: ReadAloud;
}

/** A published product's page: what it has, may contain and what is not known, its vegan and vegetarian status, and the caution. */
export function productPage({ kitchen, product, computedAt, incomplete, said }: ProductPageInput): PublicPage {
  const day = dayFormat.format(new Date(computedAt));
  const body = incomplete
    ? `<p class="lead">The kitchen’s records for this product are not complete, so its allergens are not shown here. Ask at the counter before you choose it.</p>`
    : [
        `<p class="lead">${escapeHtml(said.contains)}</p>`,
        section('May contain', said.mayContain),
        section('Not known', said.notKnown),
        section('Vegan and vegetarian', said.claims),
        section('Worth knowing', said.notes),
      ].join('');
  return {
    status: 200,
    html: document(
      `${product}: allergens (${kitchen})`,
      `<p class="kitchen">${escapeHtml(kitchen)}</p>
<h1>${escapeHtml(product)}</h1>
${body}
<aside class="caution" aria-label="Caution"><p>${escapeHtml(said.caution)}</p></aside>
<p class="basis">Worked out from the kitchen’s recorded recipes and supplier information on ${escapeHtml(day)}. Recipes change: this page shows them as they are now.</p>`,
    ),
  };
}

/** Every address that is no published product: one page in words, whatever the reason, so it says nothing of which products exist. */
export function notFoundPage(): PublicPage {
  return {
    status: 404,
    html: document(
      'No product page here',
      `<h1>No product page here</h1>
<p>This address is not a product page the kitchen has published. The kitchen may have taken it down, or the address may be mistyped.</p>
<p>Ask at the counter: the staff can tell you what each product contains.</p>`,
    ),
  };
}

/**
 * An address that names a product but not its kitchen, at an installation of several kitchens:
 * which kitchen's page it is cannot be told, so none is shown.
 */
export function whichKitchenPage(): PublicPage {
  return {
    status: 404,
    html: document(
      'Which kitchen’s product?',
      `<h1>Which kitchen’s product?</h1>
<p>This address names a product but not the kitchen it is made at, and several kitchens publish their products here, each with its own recipes and handling. Scan the code on your ticket again: it names the kitchen.</p>
<p>Ask at the counter: the staff can tell you what each product contains.</p>`,
    ),
  };
}

/** Too many pages asked for from one address in a short time. */
export function tooManyPage(): PublicPage {
  return {
    status: 429,
    html: document(
      'Too many pages at once',
      `<h1>Too many pages at once</h1>
<p>This address has asked for many product pages in a short time. Wait a minute and try again, or ask at the counter.</p>`,
    ),
  };
}
