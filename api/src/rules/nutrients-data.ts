import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { NutrientTable, nutrientTableSchema } from './core/nutrition/nutrient-table';

/** reference-data/nutrients.json in the repository (from src/rules or dist/rules alike). */
export const NUTRIENTS_FILE = resolve(__dirname, '../../../reference-data/nutrients.json');

/** Reads and validates the nutrient table; throws with the zod issues when it is malformed. */
export function loadNutrientTable(file: string = NUTRIENTS_FILE): NutrientTable {
  const raw: unknown = JSON.parse(readFileSync(file, 'utf8'));
  const parsed = nutrientTableSchema.safeParse(raw);
  if (!parsed.success) {
    const issues = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
    throw new Error(`${file} is not a valid nutrient table: ${issues}`);
  }
  return parsed.data;
}
