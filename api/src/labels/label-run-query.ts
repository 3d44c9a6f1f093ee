import { itemIdSchema } from '@crumbproof/shared';
import { z } from 'zod';

const day = (what: string) => z.iso.date({ message: `Give the ${what} production day as a date that exists, written YYYY-MM-DD.` });

/** `GET /api/labels/runs?…`: what a recall looks for. */
export const labelRunQuerySchema = z
  .strictObject({
    product: itemIdSchema.optional(),
    batch: z.string().min(1).max(20, 'A batch code has at most 20 characters (GS1 AI (10)).').optional(),
    from: day('first').optional(),
    to: day('last').optional(),
    limit: z.coerce.number().int().min(1).max(500).default(100),
    offset: z.coerce.number().int().min(0).default(0),
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { path: ['to'], message: 'The last production day comes on or after the first.' });
export type LabelRunQuery = z.infer<typeof labelRunQuerySchema>;
