import { FIGURE_KEYS, type BookIngredient, type bookIngredientSchema, type FigureKey, type Nutrition } from '@crumbproof/shared';
import type { z } from 'zod';
import { FIGURE_NAMES } from '@/lib/nutrients';

/** What the form holds: the schema's input (mayContain may be missing before defaults). */
export type IngredientFormValues = z.input<typeof bookIngredientSchema>;

/** The nutrition fields the form shows, per 100 g, in label order. */
export const NUTRITION_FIELDS = [
  { key: 'fat', label: 'Fat' },
  { key: 'saturates', label: 'of which saturates' },
  { key: 'carbohydrate', label: 'Carbohydrate' },
  { key: 'sugars', label: 'of which sugars' },
  { key: 'fibre', label: 'Fibre' },
  { key: 'protein', label: 'Protein' },
  { key: 'salt', label: 'Salt' },
] as const satisfies readonly { key: FigureKey; label: string }[];

/** Figures kept with the ingredient that the form has no field for: "energy 1472 kJ, sodium 0.0015 g". */
export function extraFigures(nutrition: Partial<Nutrition> | undefined): string[] {
  if (!nutrition) return [];
  const shown = new Set<FigureKey>(NUTRITION_FIELDS.map((field) => field.key));
  return FIGURE_KEYS.filter((key) => !shown.has(key) && typeof nutrition[key] === 'number').map((key) => {
    const { name, unit } = FIGURE_NAMES[key];
    return `${name.toLowerCase()} ${(nutrition[key] as number).toLocaleString('en-GB', { maximumFractionDigits: 5 })} ${unit}`;
  });
}

/** A typed number, or undefined for an empty box; anything else is passed on for the schema to refuse. */
export function parseNumberInput(value: unknown): unknown {
  if (value === null || value === undefined) return undefined;
  if (typeof value === 'number') return Number.isNaN(value) ? undefined : value;
  // A number box gives text; anything else is not a number the form can read, and the schema says so.
  if (typeof value !== 'string') return value;
  const text = value.trim().replace(',', '.');
  if (text === '') return undefined;
  const number = Number(text);
  return Number.isFinite(number) ? number : text;
}

/** An empty optional text box is left out, not saved as "". */
export function parseOptionalText(value: unknown): string | undefined {
  if (typeof value !== 'string') return undefined;
  return value.trim() === '' ? undefined : value;
}

/** Drops figures left empty, and the whole nutrition record when it holds no figure at all. */
export function cleanNutrition(nutrition: Nutrition | undefined): Nutrition | undefined {
  if (!nutrition) return undefined;
  const entries = Object.entries(nutrition).filter(([, value]) => value !== undefined && value !== '');
  const figures = entries.filter(([key]) => key !== 'source');
  if (figures.length === 0) return undefined;
  const clean: Nutrition = Object.fromEntries(entries);
  return clean;
}

/** The body sent to the API: no empty strings, no undefined keys. */
export function toPayload(values: BookIngredient): BookIngredient {
  const payload: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(values)) {
    if (value === undefined) continue;
    if (typeof value === 'string' && value.trim() === '' && key !== 'id' && key !== 'name') continue;
    payload[key] = value;
  }
  const nutrition = cleanNutrition(values.nutrition);
  if (nutrition) payload.nutrition = nutrition;
  else delete payload.nutrition;
  return payload as BookIngredient;
}

/** "Plain flour (T55)" → "plain-flour-t55". */
export function slugify(name: string): string {
  return name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/&/g, ' and ')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80);
}
