import { isWeighed, type Book } from '@crumbproof/shared';
import { declareAll, redeclareAfterChange } from '../rules/core';
import { recipesAbove } from '../rules/core/book-graph';
import { lineGrams, measuresOf } from '../rules/core/tree';
import type { ReferenceData } from '../rules/core/reference-schema';
import { KITCHEN_SHAPES, lineCount, syntheticKitchen, type KitchenSize } from '../rules/core/testing/synthetic-kitchen';

/** The roll-up: declaring every product of the synthetic kitchen, against a bare pass over its lines. */
export interface RollupFigures {
  fullMs: number;
  floorMs: number;
  ratio: number;
  bySize: Record<KitchenSize, { lines: number; products: number; fullMs: number; floorMs: number }>;
  incrementalMs: number;
  /** The product count above the changed ingredients (the median of them). */
  incrementalProducts: number;
}

const time = (f: () => unknown): number => {
  const t = performance.now();
  f();
  return performance.now() - t;
};
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** One bare pass over every line in dependency order that only adds weights: the least a roll-up can cost. */
export function floorPass(book: Book): number {
  const ingredients = new Map(book.ingredients.map((i) => [i.id, i]));
  const recipes = new Map(book.recipes.map((r) => [r.id, r]));
  const measures = measuresOf(book);
  const mix = new Map<string, number>();
  const visit = (id: string): number => {
    const done = mix.get(id);
    if (done !== undefined) return done;
    let sum = 0;
    for (const line of recipes.get(id)!.lines) {
      if (recipes.has(line.use)) visit(line.use);
      if (!isWeighed(line)) continue;
      const w = lineGrams(line, ingredients.get(line.use), measures);
      if (w.ok) sum += w.grams;
    }
    mix.set(id, sum);
    return sum;
  };
  let total = 0;
  for (const r of book.recipes) total += visit(r.id);
  return total;
}

/** The ingredients used by about `target` products (closest first). */
function ingredientsUsedBy(book: Book, target: number, count: number): string[] {
  const products = new Set(book.recipes.filter((r) => r.sale).map((r) => r.id));
  const above = (id: string): number => [...recipesAbove(book, id)].filter((x) => products.has(x)).length;
  return book.ingredients
    .map((i) => ({ id: i.id, n: above(i.id) }))
    .filter((x) => x.n > 0)
    .sort((a, b) => Math.abs(a.n - target) - Math.abs(b.n - target))
    .slice(0, count)
    .map((x) => x.id);
}

export function measureRollup(refs: ReferenceData, sizes: KitchenSize[] = ['small', 'standard', 'large']): RollupFigures {
  const bySize = {} as RollupFigures['bySize'];
  for (const size of sizes) {
    const book = syntheticKitchen(size);
    const floorMs = median([0, 1, 2].map(() => time(() => floorPass(book))));
    const fullMs = time(() => declareAll(book, refs));
    bySize[size] = { lines: lineCount(book), products: KITCHEN_SHAPES[size].products, fullMs, floorMs };
  }
  const standard = syntheticKitchen('standard');
  const previous = declareAll(standard, refs);
  const ids = ingredientsUsedBy(standard, 100, 20);
  const runs = ids.map((id) => {
    const changed: Book = {
      ...standard,
      ingredients: standard.ingredients.map((i) => (i.id === id ? { ...i, mayContain: [...i.mayContain, 'lupin' as const] } : i)),
    };
    return time(() => redeclareAfterChange(changed, previous, id, refs));
  });
  const s = bySize.standard ?? Object.values(bySize)[0];
  return {
    fullMs: s.fullMs,
    floorMs: s.floorMs,
    ratio: s.floorMs > 0 ? s.fullMs / s.floorMs : Infinity,
    bySize,
    incrementalMs: median(runs),
    incrementalProducts: ids.length,
  };
}
