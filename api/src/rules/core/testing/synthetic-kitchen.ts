import { toGrams } from '../quantities';
import { bookSchema, type AllergenSource, type Book, type BookInput, type Unit } from '@crumbproof/shared';

/**
 * A synthetic kitchen: an invented recipe book the size of a chain of bakeries, made from a
 * fixed seed so every run gives the same book. Sub-recipes are shared by many products and nest
 * up to eight levels deep, with a realistic mix of allergen statements, may-contains, missing
 * statements, contact lines and units, so that the cost of declaring it can be measured as the
 * book grows. Pure: no I/O.
 */
export type KitchenSize = 'small' | 'standard' | 'large';

export interface KitchenShape {
  ingredients: number;
  subRecipes: number;
  products: number;
  /** Deepest nesting of sub-recipes under a product. */
  depth: number;
  /** Mean lines per recipe (sub-recipes and products alike). */
  meanLines: number;
}

/** The standard book: 1,500 ingredients, 6,000 sub-recipes, 2,000 products, about 40,000 lines. */
const STANDARD: KitchenShape = { ingredients: 1500, subRecipes: 6000, products: 2000, depth: 8, meanLines: 5 };

export const KITCHEN_SHAPES: Record<KitchenSize, KitchenShape> = {
  small: scaled(STANDARD, 0.1),
  standard: STANDARD,
  large: scaled(STANDARD, 4),
};

function scaled(shape: KitchenShape, by: number): KitchenShape {
  return {
    ...shape,
    ingredients: Math.round(shape.ingredients * by),
    subRecipes: Math.round(shape.subRecipes * by),
    products: Math.round(shape.products * by),
  };
}

/** mulberry32: a small seeded generator of numbers in [0, 1). */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export const DEFAULT_SEED = 20261202;

type IngredientInput = BookInput['ingredients'][number];
type RecipeInput = BookInput['recipes'][number];
type LineInput = RecipeInput['lines'][number];

/** Sources with how often an ingredient states each (invented proportions, weighted to a bakery). */
const SOURCE_ODDS: Array<[AllergenSource, number]> = [
  ['wheat', 0.18],
  ['milk', 0.16],
  ['egg', 0.1],
  ['soy', 0.06],
  ['almond', 0.03],
  ['hazelnut', 0.03],
  ['walnut', 0.015],
  ['sesame', 0.025],
  ['peanut', 0.015],
  ['oats', 0.02],
  ['barley', 0.02],
  ['rye', 0.01],
  ['mustard', 0.01],
  ['celery', 0.008],
  ['lupin', 0.005],
  ['sulphites', 0.02],
];
const MAY_CONTAIN: AllergenSource[] = ['wheat', 'milk', 'egg', 'soy', 'hazelnut', 'almond', 'peanut', 'sesame'];
const ANIMAL: ReadonlySet<AllergenSource> = new Set(['milk', 'egg']);

const SYLLABLES = ['bram', 'cor', 'del', 'fen', 'gar', 'hol', 'ist', 'jun', 'kel', 'lor', 'mab', 'nor', 'oss', 'pel', 'quin', 'rav', 'sol'];
const KINDS = ['flour', 'sugar', 'paste', 'syrup', 'butter', 'cream', 'powder', 'seed', 'oil', 'fruit', 'extract', 'spice'];
const STAGES = ['base', 'dough', 'cream', 'glaze', 'filling', 'crumb', 'praline', 'batter'];
const GOODS = ['tart', 'loaf', 'bun', 'slice', 'cake', 'roll', 'pastry', 'biscuit'];

type Measured = 'weighed' | 'liquid' | 'counted';

/** The book of the given size (or shape), the same for the same seed. Parsed by the book schema. */
export function syntheticKitchen(size: KitchenSize | KitchenShape = 'standard', seed = DEFAULT_SEED): Book {
  const shape = typeof size === 'string' ? KITCHEN_SHAPES[size] : size;
  const rnd = seededRandom(seed);
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)];
  const between = (lo: number, hi: number) => lo + Math.floor(rnd() * (hi - lo + 1));
  const word = () => pick(SYLLABLES) + pick(SYLLABLES);

  const ingredients: IngredientInput[] = [];
  const measured: Measured[] = [];
  for (let n = 0; n < shape.ingredients; n++) {
    const kind = pick(KINDS);
    const how: Measured = kind === 'syrup' || kind === 'oil' || kind === 'extract' ? 'liquid' : rnd() < 0.06 ? 'counted' : 'weighed';
    const isWater = n === 0;
    const known = !isWater && rnd() >= 0.05;
    const contains: AllergenSource[] = [];
    if (known) for (const [source, odds] of SOURCE_ODDS) if (rnd() < odds) contains.push(source);
    const mayContain = rnd() < 0.2 ? [pick(MAY_CONTAIN)] : [];
    const animal = contains.some((s) => ANIMAL.has(s)) || (kind === 'butter' && rnd() < 0.5);
    const i: IngredientInput = {
      id: isWater ? 'water' : `i${n}-${kind}`,
      name: isWater ? 'Water' : `${word()} ${kind}`.replace(/^./, (c) => c.toUpperCase()),
      mayContain,
      vegan: known ? !animal : rnd() < 0.5 ? null : !animal,
      vegetarian: known ? true : null,
    };
    if (known) i.contains = contains;
    if (isWater) i.isWater = true;
    if (rnd() < 0.25) i.composition = `${word()} ${kind}${contains.includes('wheat') ? ', wheat flour' : ''}`;
    if (contains.includes('sulphites') && rnd() < 0.7) i.sulphiteMgPerKg = between(5, 400);
    if (how === 'liquid') i.gPerMl = Math.round((0.8 + rnd() * 0.6) * 100) / 100;
    if (how === 'counted') i.gEach = between(5, 60);
    ingredients.push(i);
    measured.push(isWater ? 'liquid' : how);
  }
  if (ingredients[0]) ingredients[0].gPerMl = 1;
  const byId = new Map(ingredients.map((i) => [i.id, i]));

  const ingredientLine = (index: number): LineInput => {
    const use = ingredients[index].id;
    if (rnd() < 0.04) return { use, role: 'contact' };
    const how = measured[index];
    if (how === 'counted') return { use, qty: between(1, 6), unit: 'each' };
    if (how === 'liquid') {
      const unit: Unit = rnd() < 0.2 ? 'tsp' : rnd() < 0.1 ? 'l' : 'ml';
      return { use, qty: unit === 'tsp' ? between(1, 3) : unit === 'l' ? between(1, 3) / 4 : between(10, 400), unit };
    }
    return rnd() < 0.08 ? { use, qty: between(1, 4) / 4, unit: 'kg' } : { use, qty: between(5, 500), unit: 'g' };
  };
  // A few ingredients are in many recipes (flour, sugar, butter), most in few: a skewed pick.
  const someIngredient = () => Math.floor(Math.pow(rnd(), 2.2) * ingredients.length);

  // Sub-recipes level by level: a recipe of level L uses ingredients and recipes of levels below it,
  // at least one of level L - 1, so the deepest products nest `depth` levels.
  const recipes: RecipeInput[] = [];
  const levels: string[][] = [];
  const perLevel = Math.max(1, Math.floor(shape.subRecipes / shape.depth));
  let made = 0;
  for (let level = 1; level <= shape.depth; level++) {
    const ids: string[] = [];
    const count = level === shape.depth ? shape.subRecipes - made : perLevel;
    for (let n = 0; n < count; n++) {
      const id = `s${level}-${n}-${pick(STAGES)}`;
      const lines = subLines(level);
      const r: RecipeInput = { id, name: `${word()} ${id.split('-')[2]} ${level}.${n}`, lines };
      if (rnd() < 0.4) r.finishedWeightG = Math.max(1, Math.floor(mixOf(lines, byId) * (0.8 + rnd() * 0.15)));
      recipes.push(r);
      ids.push(id);
    }
    made += count;
    levels.push(ids);
  }

  function subLines(level: number): LineInput[] {
    const count = Math.max(2, between(shape.meanLines - 2, shape.meanLines + 2));
    const lines: LineInput[] = [];
    const used = new Set<string>();
    const add = (line: LineInput) => {
      const key = `${line.use}:${line.role ?? ''}`;
      if (used.has(key)) return;
      used.add(key);
      lines.push(line);
    };
    if (level > 1) add({ use: pick(levels[level - 2]), qty: between(50, 600), unit: 'g' });
    while (lines.length < count) {
      if (level > 1 && rnd() < 0.2) add({ use: pick(levels[Math.floor(rnd() * (level - 1))]), qty: between(20, 300), unit: 'g' });
      else add(ingredientLine(someIngredient()));
    }
    return lines;
  }

  for (let n = 0; n < shape.products; n++) {
    const lines: LineInput[] = [];
    const used = new Set<string>();
    const count = Math.max(2, between(shape.meanLines - 2, shape.meanLines + 2));
    const top = Math.min(shape.depth, 1 + Math.floor(rnd() * shape.depth));
    const first = pick(levels[top - 1]);
    lines.push({ use: first, qty: between(100, 800), unit: 'g' });
    used.add(first);
    while (lines.length < count) {
      const line =
        rnd() < 0.35
          ? { use: pick(levels[Math.floor(rnd() * shape.depth)]), qty: between(20, 300), unit: 'g' as const }
          : ingredientLine(someIngredient());
      const key = `${line.use}:${line.role ?? ''}`;
      if (used.has(key)) continue;
      used.add(key);
      lines.push(line);
    }
    const mix = mixOf(lines, byId);
    recipes.push({
      id: `p${n}-${pick(GOODS)}`,
      name: `${word()} ${pick(GOODS)} ${n}`.replace(/^./, (c) => c.toUpperCase()),
      lines,
      finishedWeightG: Math.max(1, Math.floor(mix * (0.85 + rnd() * 0.1))),
      sale: { portionG: between(40, 120) },
    });
  }

  return bookSchema.parse({
    crumbproofBook: 1,
    site: {
      name: 'Synthetic bakehouse (invented)',
      regime: 'UK',
      measures: 'metric',
      handles: [
        { allergen: 'sesame', controls: 'shared-equipment' },
        { allergen: 'peanut', controls: 'segregated' },
      ],
    },
    ingredients,
    recipes,
  });
}

/**
 * The mix weight of some lines, as the rules engine weighs them (toGrams with the book's metric
 * measures; a sub-recipe line is in g or kg), so that an invented finished weight is never more
 * than what goes into the recipe.
 */
function mixOf(lines: LineInput[], ingredients: ReadonlyMap<string, IngredientInput>): number {
  return lines.reduce((sum, l) => {
    if (l.role === 'contact' || l.qty === undefined) return sum;
    const ingredient = ingredients.get(l.use);
    if (!ingredient) return sum + (l.unit === 'kg' ? l.qty * 1000 : l.qty);
    const weighed = toGrams(l.qty, l.unit ?? 'g', ingredient, 'metric');
    if (!weighed.ok) throw new Error(`The synthetic line of ${l.use} cannot be weighed: it needs ${weighed.needs}.`);
    return sum + weighed.grams;
  }, 0);
}

/** How many lines a book has (every recipe's). */
export function lineCount(book: Book): number {
  return book.recipes.reduce((sum, r) => sum + r.lines.length, 0);
}
