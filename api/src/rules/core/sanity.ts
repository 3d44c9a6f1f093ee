import {
  FIGURE_NAMES,
  MAX_ENERGY_KCAL_PER_100G,
  MAX_ENERGY_KJ_PER_100G,
  NUTRIENT_KEYS,
  type DeclarationNotice,
  type NutrientFigures,
} from '@crumbproof/shared';
import { compare } from './compare';

/**
 * Sanity checks on quantities: figures that are possible to record but out of proportion, most
 * often a slip of unit (kg for g) or of a digit. Each is a warning that says what looks wrong and
 * what to check; none refuses a declaration or a save.
 */

/** One of the product's own lines, weighed (contact lines, which carry no weight, are left out). */
export interface WeighedLineFact {
  /** 1-based, as the recipe lists it. */
  line: number;
  name: string;
  grams: number;
}

const grams = (g: number) => `${Number(g.toPrecision(6))} g`;

/**
 * A line heavier than the whole finished product. Baking loses water, so lines together may weigh
 * more than the product, but one line alone weighing more than all of it is out of proportion
 * (common practice; no published source sets this limit). Only where a finished weight is
 * recorded: without one the finished weight is the sum of the lines, which no line exceeds.
 */
export function lineWeightWarnings(
  product: string,
  finishedWeightG: number | undefined,
  lines: readonly WeighedLineFact[],
): DeclarationNotice[] {
  if (finishedWeightG === undefined) return [];
  return lines
    .filter((l) => compare(l.grams, 'gt', finishedWeightG))
    .map((l) => ({
      code: 'line-weight-out-of-proportion' as const,
      line: l.line,
      message: `Line ${l.line} (${l.name}) weighs ${grams(l.grams)}, more than the whole finished weight of ${product} (${grams(finishedWeightG)}). Check the line's quantity and unit (g or kg), and the finished weight.`,
    }));
}

/**
 * A portion heavier than the finished product it is cut from. A portion may be the whole product
 * (equal weights), never more of it (common practice; no published source sets this limit).
 */
export function portionWarnings(product: string, portionG: number | null | undefined, finishedG: number): DeclarationNotice[] {
  if (portionG === null || portionG === undefined || !(finishedG > 0)) return [];
  if (!compare(portionG, 'gt', finishedG)) return [];
  return [
    {
      code: 'portion-over-finished-weight',
      message: `A portion of ${product} (${grams(portionG)}) weighs more than the whole finished product (${grams(finishedG)}). Check the portion weight, the finished weight and the lines' units.`,
    },
  ];
}

/** The most a figure per 100 g can physically be: 100 g of any nutrient (100 000 mg of cholesterol), pure fat's energy. */
const LIMITS: Partial<Record<keyof NutrientFigures, number>> = {
  ...Object.fromEntries(NUTRIENT_KEYS.map((k) => [k, k === 'cholesterolMg' ? 100_000 : 100])),
  energyKj: MAX_ENERGY_KJ_PER_100G,
  energyKcal: MAX_ENERGY_KCAL_PER_100G,
};

/**
 * Nutrition per 100 g of the finished product beyond physical limits: 100 g of a nutrient cannot
 * hold more than 100 g of it, and nothing holds more energy than pure fat (37 kJ, 9 kcal per gram,
 * Regulation (EU) No 1169/2011 Annex XIV). Such a figure comes from an ingredient's figures not
 * given per 100 g, a line's unit, or a finished weight far below the mix.
 */
export function nutritionLimitWarnings(product: string, per100g: NutrientFigures): DeclarationNotice[] {
  const out: DeclarationNotice[] = [];
  for (const [key, limit] of Object.entries(LIMITS) as Array<[keyof NutrientFigures, number]>) {
    const value = per100g[key];
    if (value === null || !compare(value, 'gt', limit)) continue;
    const { name, unit } = FIGURE_NAMES[key];
    const why = key.startsWith('energy') ? 'more than pure fat holds' : `more than the 100 g it is part of`;
    out.push({
      code: 'nutrition-out-of-limits',
      message: `${name} of ${product} works out at ${Number(value.toPrecision(6))} ${unit} per 100 g (at most ${limit} ${unit}), ${why}. Check the ingredients' figures are per 100 g, the lines' quantities and units, and the finished weight.`,
    });
  }
  return out;
}
