import type {
  Book,
  BookIngredient,
  BookRecipe,
  IngredientRef,
  MeasureSystem,
  NutrientKey,
  NutritionSource,
  UnweighedLine,
} from '@crumbproof/shared';
import { isWeighed, NUTRIENT_KEYS } from '@crumbproof/shared';
import { toGrams } from '../quantities';
import { ingredientFigures } from './ingredient-figures';

/**
 * A recipe rolled up to its finished product: nutrient grams per gram of finished product.
 * Invariant: a nutrient's value is known exactly when its `missing` map is empty.
 */
export interface Rollup {
  /** Null when the finished weight cannot be known (no finishedWeightG and an unweighed line). */
  weightG: number | null;
  weightFrom: 'finishedWeightG' | 'sumOfLines';
  perGram: Record<NutrientKey, number>;
  missing: Record<NutrientKey, Map<string, IngredientRef>>;
  leaves: Map<string, NutritionSource>;
  unweighed: UnweighedLine[];
}

type Item = { kind: 'ingredient'; ingredient: BookIngredient } | { kind: 'recipe'; recipe: BookRecipe };

function emptyMissing(): Record<NutrientKey, Map<string, IngredientRef>> {
  const m = {} as Record<NutrientKey, Map<string, IngredientRef>>;
  for (const k of NUTRIENT_KEYS) m[k] = new Map();
  return m;
}

function zeros(): Record<NutrientKey, number> {
  const z = {} as Record<NutrientKey, number>;
  for (const k of NUTRIENT_KEYS) z[k] = 0;
  return z;
}

/** Rolls recipes up with memoisation; throws on an unknown id, an ambiguous id or a cycle. */
export class NutritionRoller {
  private readonly ingredients = new Map<string, BookIngredient>();
  private readonly recipes = new Map<string, BookRecipe>();
  private readonly done = new Map<string, Rollup>();

  constructor(
    book: Book,
    private readonly measures: MeasureSystem,
  ) {
    for (const i of book.ingredients) this.ingredients.set(i.id, i);
    for (const r of book.recipes) this.recipes.set(r.id, r);
  }

  recipe(id: string): BookRecipe {
    const r = this.recipes.get(id);
    if (!r) throw new Error(`Unknown recipe "${id}".`);
    return r;
  }

  private item(use: string, inRecipe: string): Item {
    const ingredient = this.ingredients.get(use);
    const recipe = this.recipes.get(use);
    if (ingredient && recipe) throw new Error(`"${use}" in recipe "${inRecipe}" is both an ingredient and a recipe.`);
    if (ingredient) return { kind: 'ingredient', ingredient };
    if (recipe) return { kind: 'recipe', recipe };
    throw new Error(`Recipe "${inRecipe}" uses "${use}", which is neither an ingredient nor a recipe.`);
  }

  roll(recipeId: string, path: string[] = []): Rollup {
    const cached = this.done.get(recipeId);
    if (cached) return cached;
    if (path.includes(recipeId)) throw new Error(`Recipe cycle: ${[...path, recipeId].join(' → ')}.`);
    const recipe = this.recipe(recipeId);
    const here = [...path, recipeId];

    const totals = zeros();
    const missing = emptyMissing();
    const leaves = new Map<string, NutritionSource>();
    const unweighed: UnweighedLine[] = [];
    let lineWeight = 0;
    let allWeighed = true;

    const markAll = (refs: Iterable<IngredientRef>): void => {
      for (const { id, name } of refs) for (const k of NUTRIENT_KEYS) missing[k].set(id, { id, name });
    };
    const addUnweighed = (u: UnweighedLine): void => {
      if (!unweighed.some((x) => x.recipeId === u.recipeId && x.use === u.use && x.needs === u.needs)) unweighed.push(u);
    };

    for (const line of recipe.lines) {
      const item = this.item(line.use, recipeId);
      if (!isWeighed(line)) continue; // a contact line: cross-contact only, no weight, no nutrients
      const child = item.kind === 'recipe' ? this.roll(item.recipe.id, here) : null;
      const lineLeaves: NutritionSource[] =
        item.kind === 'ingredient' ? [sourceOf(item.ingredient)] : [...(child as Rollup).leaves.values()];
      for (const l of lineLeaves) if (!leaves.has(l.id)) leaves.set(l.id, l);
      for (const u of child?.unweighed ?? []) addUnweighed(u);

      const weighable = item.kind === 'ingredient' ? item.ingredient : {};
      const w = toGrams(line.qty, line.unit, weighable, this.measures);
      if (!w.ok) {
        addUnweighed({ recipeId, use: line.use, needs: w.needs });
        allWeighed = false;
        markAll(lineLeaves);
        continue;
      }
      lineWeight += w.grams;

      if (item.kind === 'ingredient') {
        const figs = ingredientFigures(item.ingredient);
        const ref = { id: item.ingredient.id, name: item.ingredient.name };
        for (const k of NUTRIENT_KEYS) {
          const v = figs[k];
          if (v === null) missing[k].set(ref.id, ref);
          else totals[k] += (w.grams * v) / 100;
        }
      } else {
        const c = child as Rollup;
        for (const k of NUTRIENT_KEYS) {
          for (const [id, ref] of c.missing[k]) missing[k].set(id, ref);
          totals[k] += w.grams * c.perGram[k];
        }
      }
    }

    const weightFrom = recipe.finishedWeightG !== undefined ? 'finishedWeightG' : 'sumOfLines';
    const weightG: number | null = recipe.finishedWeightG ?? (allWeighed ? lineWeight : null);
    if (weightG === null) markAll(leaves.values());
    if (weightG !== null && weightG <= 0) {
      throw new Error(`Recipe "${recipeId}" has no ingredient line to weigh and no finished weight.`);
    }
    const perGram = zeros();
    if (weightG !== null) for (const k of NUTRIENT_KEYS) perGram[k] = totals[k] / weightG;

    const result: Rollup = { weightG, weightFrom, perGram, missing, leaves, unweighed };
    this.done.set(recipeId, result);
    return result;
  }
}

function sourceOf(i: BookIngredient): NutritionSource {
  return { id: i.id, name: i.name, source: i.nutrition?.source ?? null, hasNutrition: i.nutrition !== undefined };
}
