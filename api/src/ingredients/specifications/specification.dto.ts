import { plainText } from '@crumbproof/shared';
import { z } from 'zod';

/** Today's date in the kitchen (the server's calendar), as YYYY-MM-DD. */
export function today(now = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

/** The day `days` after a kitchen date (YYYY-MM-DD), counted on the calendar. */
export function addDays(date: string, days: number): string {
  const [y, m, d] = date.split('-').map(Number);
  const next = new Date(Date.UTC(y, m - 1, d + days));
  return next.toISOString().slice(0, 10);
}

/**
 * The review-by date a specification gets when none is given: one year after the day it is
 * uploaded (29 February gives 28 February of the next year).
 */
export function defaultReviewBy(uploaded: string): string {
  const [y, m, d] = uploaded.split('-').map(Number);
  const next = new Date(Date.UTC(y + 1, m - 1, d));
  // A day the next year does not have rolls into March; keep the last day of February.
  return next.getUTCMonth() === m - 1 ? next.toISOString().slice(0, 10) : `${y + 1}-02-28`;
}

function isRealDate(value: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(value);
  if (!m) return false;
  const d = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  return d.getUTCFullYear() === Number(m[1]) && d.getUTCMonth() === Number(m[2]) - 1 && d.getUTCDate() === Number(m[3]);
}

const REVIEW_BY_TEXT =
  'Give the date by which the kitchen must check this specification again as YYYY-MM-DD, or leave it out for one year from today.';

/** The text fields sent with a specification file; no review-by date (or an empty one) is one year from the upload. */
export const specificationFieldsSchema = z.strictObject({
  reviewBy: z
    .string({ error: REVIEW_BY_TEXT })
    .trim()
    .superRefine((value, ctx) => {
      if (value === '') return;
      if (!/^\d{4}-\d{2}-\d{2}$/.test(value)) ctx.addIssue({ code: 'custom', message: `'${value}' is not a date written as YYYY-MM-DD.` });
      else if (!isRealDate(value)) ctx.addIssue({ code: 'custom', message: `${value} is not a real date.` });
      else if (value < today())
        ctx.addIssue({ code: 'custom', message: `${value} has already passed; give today (${today()}) or a later date.` });
    })
    .optional(),
  note: plainText(z.string().trim().max(500, 'Keep the note to 500 characters.')).optional(),
});
export type SpecificationFields = z.infer<typeof specificationFieldsSchema>;

export const ACCEPTED_SPECIFICATION_TYPES: Record<string, string> = {
  'application/pdf': 'pdf',
  'image/png': 'png',
  'image/jpeg': 'jpg',
  'image/webp': 'webp',
};
