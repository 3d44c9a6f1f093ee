import type {
  Book,
  FigureKey,
  IngredientRef,
  MeasureSystem,
  MissingFigure,
  NutrientFigures,
  NutrientKey,
  NutritionDeclaration,
  NutritionLabel,
  Regime,
} from '@crumbproof/shared';
import { FIGURE_KEYS, NUTRIENT_KEYS } from '@crumbproof/shared';
import { euEnergy } from './energy';
import { euLabel, usLabel } from './labels';
import { NutritionRoller, Rollup } from './rollup';

export interface NutritionOptions {
  measures: MeasureSystem;
  regime: Regime;
}

/** The nutrients Annex XIV energy is computed from. */
export const ENERGY_NEEDS: readonly NutrientKey[] = [
  'fat',
  'salatrims',
  'carbohydrate',
  'polyols',
  'erythritol',
  'fibre',
  'protein',
  'alcohol',
  'organicAcids',
];

function figuresPer(r: Rollup, grams: number): NutrientFigures {
  const f = {} as NutrientFigures;
  for (const k of NUTRIENT_KEYS) f[k] = r.missing[k].size === 0 ? r.perGram[k] * grams : null;
  const energyKnown = ENERGY_NEEDS.every((k) => f[k] !== null);
  if (energyKnown) {
    const e = euEnergy({
      fat: f.fat as number,
      salatrims: f.salatrims as number,
      carbohydrate: f.carbohydrate as number,
      polyols: f.polyols as number,
      erythritol: f.erythritol as number,
      fibre: f.fibre as number,
      protein: f.protein as number,
      alcohol: f.alcohol as number,
      organicAcids: f.organicAcids as number,
    });
    f.energyKj = e.kj;
    f.energyKcal = e.kcal;
  } else {
    f.energyKj = null;
    f.energyKcal = null;
  }
  return f;
}

function missingOf(r: Rollup): MissingFigure[] {
  const energy = new Map<string, IngredientRef>();
  for (const k of ENERGY_NEEDS) for (const [id, ref] of r.missing[k]) energy.set(id, ref);
  const byKey = (key: FigureKey): Map<string, IngredientRef> => (key === 'energyKj' || key === 'energyKcal' ? energy : r.missing[key]);
  // List ingredients in recipe order (the order leaves were first met).
  const order = new Map([...r.leaves.keys()].map((id, n) => [id, n]));
  // An id not among the leaves sorts as indexOf placed it, first.
  const at = (id: string) => order.get(id) ?? -1;
  const out: MissingFigure[] = [];
  for (const key of FIGURE_KEYS) {
    const m = byKey(key);
    if (m.size === 0) continue;
    const ingredients = [...m.values()].sort((a, b) => at(a.id) - at(b.id));
    out.push({ nutrient: key, ingredients });
  }
  return out;
}

function labelFor(regime: Regime, per100g: NutrientFigures, perPortion: NutrientFigures | null, portionG: number | null): NutritionLabel {
  const eu = euLabel(per100g, perPortion, portionG);
  const us = perPortion && portionG !== null ? usLabel(perPortion, portionG) : null;
  const noPortion = us ? null : 'A US Nutrition Facts label is per serving: give the recipe a portion size.';
  switch (regime) {
    case 'EU':
    case 'UK':
      return { eu, us, printed: 'eu', note: null };
    case 'US':
      return { eu, us, printed: us ? 'us' : null, note: noPortion };
    case 'CA':
    case 'ANZ':
      return { eu, us, printed: null, note: `No nutrition label format for ${regime} yet: the EU and US formats are shown for reference.` };
    default: {
      const never: never = regime;
      throw new Error(`Unknown regime ${String(never)}`);
    }
  }
}

/**
 * Nutrition of a recipe per 100 g of finished product and per portion (sale.portionG).
 * Ingredient figures are per 100 g as eaten raw; the recipe's total is divided by its weight
 * after baking (finishedWeightG, or else the sum of its ingredient-line weights). A line using
 * a sub-recipe brings its grams × the sub-recipe's nutrients per gram of finished sub-recipe.
 * Contact lines bring nothing.
 */
export function computeNutrition(book: Book, recipeId: string, opts: NutritionOptions): NutritionDeclaration {
  return nutritionOf(new NutritionRoller(book, opts.measures), recipeId, opts.regime);
}

/**
 * A recipe's nutrition as computeNutrition gives it, from a roller of the book that may have rolled
 * other recipes already (each recipe's rollup depends only on what is below it, so one roller serves
 * every recipe of a book).
 */
export function nutritionOf(roller: NutritionRoller, recipeId: string, regime: Regime): NutritionDeclaration {
  const recipe = roller.recipe(recipeId);
  const r = roller.roll(recipeId);
  const portionG = recipe.sale?.portionG ?? null;
  const per100g = figuresPer(r, 100);
  const perPortion = portionG !== null ? figuresPer(r, portionG) : null;
  const incomplete = FIGURE_KEYS.filter((k) => per100g[k] === null);
  return {
    recipeId,
    recipeName: recipe.name,
    regime,
    finishedWeightG: r.weightG,
    weightFrom: r.weightFrom,
    portionG,
    per100g,
    perPortion,
    incomplete,
    missing: missingOf(r),
    unweighed: r.unweighed,
    sources: [...r.leaves.values()],
    label: labelFor(regime, per100g, perPortion, portionG),
  };
}
