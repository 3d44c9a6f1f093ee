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
  /** The path as one string, the same for the same ids: tells paths apart without comparing arrays. */
  key: string;
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

/**
 * The book looked up by id, with each recipe's lines weighed and merged once: built once for a
 * whole book's declarations and shared by every product's tree.
 */
export interface BookIndex {
  ingredients: Map<string, BookIngredient>;
  recipes: Map<string, BookRecipe>;
  measures: MeasureSystem;
  weighed: Map<string, Weighed[]>;
  mixes: Map<string, number>;
}

export function indexBook(book: Book): BookIndex {
  return {
    ingredients: new Map(book.ingredients.map((i) => [i.id, i])),
    recipes: new Map(book.recipes.map((r) => [r.id, r])),
    measures: measuresOf(book),
    weighed: new Map(),
    mixes: new Map(),
  };
}

/** A recipe's lines in grams, lines of the same id and role merged (worked out once per index). */
function weighedLinesOf(index: BookIndex, recipe: BookRecipe): Weighed[] {
  const done = index.weighed.get(recipe.id);
  if (done) return done;
  const lines = mergeWeighed(
    recipe.lines.map((line) => {
      const ingredient = index.ingredients.get(line.use);
      const recipeUsed = index.recipes.get(line.use);
      let grams = 0;
      if (isWeighed(line)) {
        const w = lineGrams(line, ingredient, index.measures);
        if (!w.ok)
          throw new Error(`${recipe.name} uses ${ingredient?.name ?? line.use} in a unit that cannot be weighed; check the book first.`);
        grams = w.grams;
      }
      return { line, ingredient, recipe: recipeUsed, grams };
    }),
  );
  index.weighed.set(recipe.id, lines);
  return lines;
}

/** The sum of a recipe's merged line weights (contact lines weigh 0). */
export function mixOfRecipe(index: BookIndex, recipe: BookRecipe): number {
  let mix = index.mixes.get(recipe.id);
  if (mix === undefined) {
    mix = weighedLinesOf(index, recipe).reduce((sum, l) => sum + l.grams, 0);
    index.mixes.set(recipe.id, mix);
  }
  return mix;
}

/** Joins a path's ids into its key (ids are lower-case letters, digits and hyphens, so never hold it). */
export const PATH_SEPARATOR = '\u0000';
export const pathKey = (path: string[]): string => path.join(PATH_SEPARATOR);

export function buildTree(book: Book, productId: string, index: BookIndex = indexBook(book)): ProductTree {
  const product = index.recipes.get(productId);
  if (!product) throw new Error(`There is no recipe '${productId}' in this book.`);

  const expand = (recipe: BookRecipe, path: string[], key: string, factor: number, share: number, contact: boolean): TreeNode[] => {
    const lines = weighedLinesOf(index, recipe);
    const mix = mixOfRecipe(index, recipe);
    return lines.map(({ line, ingredient, recipe: sub, grams }) => {
      const role: LineRole = contact || line.role === 'contact' ? 'contact' : 'ingredient';
      const usedG = role === 'contact' ? 0 : grams;
      const massG = usedG * factor;
      const nodeShare = mix > 0 ? (share * usedG) / mix : 0;
      const nodePath = [...path, line.use];
      const nodeKey = `${key}${PATH_SEPARATOR}${line.use}`;
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
          key: nodeKey,
          ingredient,
          children: [],
        };
      }
      if (!sub) throw new Error(`${recipe.name} uses '${line.use}', which is not in this book; check the book first.`);
      if (path.includes(sub.id)) throw new Error(`${sub.name} contains itself; check the book first.`);
      const batch = sub.finishedWeightG ?? mixOfRecipe(index, sub);
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
        key: nodeKey,
        recipe: sub,
        children: expand(sub, nodePath, nodeKey, childFactor, nodeShare, role === 'contact'),
      };
    });
  };

  const mixG = mixOfRecipe(index, product);
  return {
    recipe: product,
    mixG,
    finishedG: product.finishedWeightG ?? mixG,
    children: expand(product, [product.id], product.id, 1, 1, false),
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
export function leavesOf(nodes: TreeNode[], out: TreeNode[] = []): TreeNode[] {
  for (const n of nodes) {
    if (n.kind === 'ingredient') out.push(n);
    else leavesOf(n.children, out);
  }
  return out;
}
