import {
  isWeighed,
  type Book,
  type BookIngredient,
  type BookRecipe,
  type LineRole,
  type MeasureSystem,
  type WeighedLine,
} from '@crumbproof/shared';
import { defaultMeasures, toGrams, type WeighResult } from './quantities';

/**
 * A product resolved into a tree of weighed lines.
 *
 * - `usedG`: the line's weight at the time of use in its own recipe (lines that use the same
 *   id in one recipe are merged). Contact lines (and everything under them) weigh 0.
 * - `massG`: how much of this node's raw material ends up in the product. A sub-recipe used at
 *   X g whose batch weighs B g (finishedWeightG, else the sum of its lines) scales its lines by X / B.
 * - `share`: fraction of the product's mix. Top-level lines: usedG / product mix. A sub-recipe's
 *   lines split their parent's share in proportion to the sub-recipe's own mix.
 */
export interface TreeNode {
  kind: 'ingredient' | 'recipe';
  id: string;
  name: string;
  /** 'contact' when this line or any line above it is a contact line. */
  role: LineRole;
  usedG: number;
  massG: number;
  share: number;
  /** Ids from the product down to this node. */
  path: string[];
  ingredient?: BookIngredient;
  recipe?: BookRecipe;
  children: TreeNode[];
}

export interface ProductTree {
  recipe: BookRecipe;
  /** Sum of the product's own (non-contact) lines. */
  mixG: number;
  /** finishedWeightG, else mixG. */
  finishedG: number;
  children: TreeNode[];
}

export function measuresOf(book: Book): MeasureSystem {
  return book.site.measures ?? defaultMeasures(book.site.regime);
}

/** A weighed line in grams: an ingredient through its measures, a sub-recipe in g or kg. */
export function lineGrams(line: WeighedLine, ingredient: BookIngredient | undefined, measures: MeasureSystem): WeighResult {
  if (ingredient) return toGrams(line.qty, line.unit, ingredient, measures);
  return { ok: true, grams: line.unit === 'kg' ? line.qty * 1000 : line.qty };
}

export function buildTree(book: Book, productId: string): ProductTree {
  const ingredients = new Map(book.ingredients.map((i) => [i.id, i]));
  const recipes = new Map(book.recipes.map((r) => [r.id, r]));
  const measures = measuresOf(book);
  const product = recipes.get(productId);
  if (!product) throw new Error(`There is no recipe '${productId}' in this book.`);

  const weigh = (recipe: BookRecipe) =>
    mergeWeighed(
      recipe.lines.map((line) => {
        const ingredient = ingredients.get(line.use);
        const recipeUsed = recipes.get(line.use);
        let grams = 0;
        if (isWeighed(line)) {
          const w = lineGrams(line, ingredient, measures);
          if (!w.ok)
            throw new Error(`${recipe.name} uses ${ingredient?.name ?? line.use} in a unit that cannot be weighed; check the book first.`);
          grams = w.grams;
        }
        return { line, ingredient, recipe: recipeUsed, grams };
      }),
    );

  const mixOf = (recipe: BookRecipe) => weigh(recipe).reduce((sum, l) => sum + l.grams, 0);

  const expand = (recipe: BookRecipe, path: string[], factor: number, share: number, contact: boolean): TreeNode[] => {
    const lines = weigh(recipe);
    const mix = lines.reduce((sum, l) => sum + l.grams, 0);
    return lines.map(({ line, ingredient, recipe: sub, grams }) => {
      const role: LineRole = contact || line.role === 'contact' ? 'contact' : 'ingredient';
      const usedG = role === 'contact' ? 0 : grams;
      const massG = usedG * factor;
      const nodeShare = mix > 0 ? (share * usedG) / mix : 0;
      const nodePath = [...path, line.use];
      if (ingredient) {
        return {
          kind: 'ingredient',
          id: ingredient.id,
          name: ingredient.name,
          role,
          usedG,
          massG,
          share: nodeShare,
          path: nodePath,
          ingredient,
          children: [],
        };
      }
      if (!sub) throw new Error(`${recipe.name} uses '${line.use}', which is not in this book; check the book first.`);
      if (path.includes(sub.id)) throw new Error(`${sub.name} contains itself; check the book first.`);
      const batch = sub.finishedWeightG ?? mixOf(sub);
      const childFactor = batch > 0 ? massG / batch : 0;
      return {
        kind: 'recipe',
        id: sub.id,
        name: sub.name,
        role,
        usedG,
        massG,
        share: nodeShare,
        path: nodePath,
        recipe: sub,
        children: expand(sub, nodePath, childFactor, nodeShare, role === 'contact'),
      };
    });
  };

  const mixG = mixOf(product);
  return {
    recipe: product,
    mixG,
    finishedG: product.finishedWeightG ?? mixG,
    children: expand(product, [product.id], 1, 1, false),
  };
}

interface Weighed {
  line: BookRecipe['lines'][number];
  ingredient?: BookIngredient;
  recipe?: BookRecipe;
  grams: number;
}

/** Lines that use the same id with the same role in one recipe count as one line (weights added). */
function mergeWeighed(lines: Weighed[]): Weighed[] {
  const merged: Weighed[] = [];
  for (const l of lines) {
    const role = l.line.role ?? 'ingredient';
    const same = merged.find((m) => m.line.use === l.line.use && (m.line.role ?? 'ingredient') === role);
    if (same) same.grams += l.grams;
    else merged.push({ ...l });
  }
  return merged;
}

/** Every ingredient node (leaf) of the tree, depth first in line order. */
export function leavesOf(nodes: TreeNode[]): TreeNode[] {
  return nodes.flatMap((n) => (n.kind === 'ingredient' ? [n] : leavesOf(n.children)));
}
