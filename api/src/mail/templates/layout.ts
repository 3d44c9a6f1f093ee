/**
 * The one layout of Crumbproof's mail: plain text and HTML from the same parts, every piece of
 * text escaped into the HTML (a name can hold < or &), a warm paper ground with one accent and
 * Atkinson Hyperlegible where the reader's mail program has it. Templates are plain functions
 * that return a RenderedMail; MailService.enqueue takes one with its kind and recipients.
 */
export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

/**
 * Said in every mail about allergens, as the product says it beside every answer: what
 * Crumbproof shows comes from what the kitchen recorded.
 */
export const ALLERGEN_MAIL_CAUTION =
  'Every declaration is worked out from the recipes and supplier information recorded in this kitchen: check it against current supplier specifications. Cross-contact can happen in any kitchen; local law and the kitchen’s own food-safety system decide.';

const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]);
}

export interface MailParts {
  subject: string;
  /** "Hello Ada," */
  greeting: string;
  paragraphs: string[];
  /** One button, written out as its address in the plain text. */
  action?: { label: string; url: string };
  /** Said after the button (how long a link works, what to do if the mail was not expected). */
  after?: string[];
  /** Adds ALLERGEN_MAIL_CAUTION: for every mail that speaks of allergens or declarations. */
  aboutAllergens?: boolean;
  /** The kitchen the mail comes from, in the footer. */
  kitchen: string;
}

/** The web app's paper, ink and its one accent, damson (web/src/lib/theme.ts). */
const INK = '#231B14';
const PAPER = '#FAF5EC';
const ACCENT = '#5E2750';
const FONT = "'Atkinson Hyperlegible', Verdana, Arial, sans-serif";

export function renderMail(parts: MailParts): RenderedMail {
  const after = parts.after ?? [];
  const caution = parts.aboutAllergens ? [ALLERGEN_MAIL_CAUTION] : [];
  const footer = `Sent by Crumbproof for ${parts.kitchen}.`;

  const text = [
    parts.greeting,
    ...parts.paragraphs,
    ...(parts.action ? [`${parts.action.label}:\n${parts.action.url}`] : []),
    ...after,
    ...caution,
    `-- \n${footer}`,
  ].join('\n\n');

  const p = (t: string, extra = '') => `<p style="margin:0 0 16px;${extra}">${escapeHtml(t)}</p>`;
  const button = parts.action
    ? `<p style="margin:24px 0;"><a href="${escapeHtml(parts.action.url)}" style="display:inline-block;padding:12px 20px;background:${ACCENT};color:#ffffff;text-decoration:none;border-radius:6px;font-weight:bold;">${escapeHtml(parts.action.label)}</a></p>` +
      p(`If the button does not open, copy this address into your browser: ${parts.action.url}`, 'font-size:14px;word-break:break-all;')
    : '';
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>${escapeHtml(parts.subject)}</title></head>
<body style="margin:0;padding:0;background:${PAPER};color:${INK};font-family:${FONT};font-size:16px;line-height:1.5;">
<div style="max-width:560px;margin:0 auto;padding:24px;">
${p(parts.greeting)}
${parts.paragraphs.map((t) => p(t)).join('\n')}
${button}
${after.map((t) => p(t)).join('\n')}
${caution.map((t) => p(t, `border-left:4px solid ${ACCENT};padding-left:12px;`)).join('\n')}
<p style="margin:32px 0 0;font-size:14px;border-top:1px solid #E4D7C2;padding-top:12px;">${escapeHtml(footer)}</p>
</div>
</body></html>
`;
  return { subject: parts.subject, text, html };
}
