import { plainText } from '@crumbproof/shared';
import { z } from 'zod';

/** Today's date in the kitchen (the server's calendar), as YYYY-MM-DD. */
export function today(now = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

function isRealDate(value: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(value);
  if (!m) return false;
  const d = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  return d.getUTCFullYear() === Number(m[1]) && d.getUTCMonth() === Number(m[2]) - 1 && d.getUTCDate() === Number(m[3]);
}

const REVIEW_BY_REQUIRED = 'Give the date by which the kitchen must check this specification again, as YYYY-MM-DD.';

/** The text fields sent with a specification file. */
export const specificationFieldsSchema = z.strictObject({
  reviewBy: z
    .string({ error: REVIEW_BY_REQUIRED })
    .trim()
    .superRefine((value, ctx) => {
      if (value === '') ctx.addIssue({ code: 'custom', message: REVIEW_BY_REQUIRED });
      else if (!/^\d{4}-\d{2}-\d{2}$/.test(value))
        ctx.addIssue({ code: 'custom', message: `'${value}' is not a date written as YYYY-MM-DD.` });
      else if (!isRealDate(value)) ctx.addIssue({ code: 'custom', message: `${value} is not a real date.` });
      else if (value < today())
        ctx.addIssue({ code: 'custom', message: `${value} has already passed; give today (${today()}) or a later date.` });
    }),
  note: plainText(z.string().trim().max(500, 'Keep the note to 500 characters.')).optional(),
});
export type SpecificationFields = z.infer<typeof specificationFieldsSchema>;

export const ACCEPTED_SPECIFICATION_TYPES: Record<string, string> = {
  'application/pdf': 'pdf',
  'image/png': 'png',
  'image/jpeg': 'jpg',
  'image/webp': 'webp',
};
