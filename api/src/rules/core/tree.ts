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
export interface TreeNode extends Omit<LineNode, 'children'> {
  /** Ids from the product down to this node. */
  path: string[];
  /** The path as one string, the same for the same ids: tells paths apart without comparing arrays. */
  key: string;
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
  /** By recipe id: whether two of its merged lines use the same id (once in the mix, once by contact). */
  repeats: Map<string, boolean>;
  /** By recipe id: whether its ingredient list depends on a bake loss from above it (declare.ts). */
  bakeDependent: Map<string, boolean>;
}

export function indexBook(book: Book): BookIndex {
  return {
    ingredients: new Map(book.ingredients.map((i) => [i.id, i])),
    recipes: new Map(book.recipes.map((r) => [r.id, r])),
    measures: measuresOf(book),
    weighed: new Map(),
    mixes: new Map(),
    repeats: new Map(),
    bakeDependent: new Map(),
  };
}

/** A recipe's lines in grams, lines of the same id and role merged (worked out once per index). */
export function weighedLinesOf(index: BookIndex, recipe: BookRecipe): Weighed[] {
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
    const mix = mixOfRecipe(index, recipe);
    return weighedLinesOf(index, recipe).map((weighed) => {
      const node = placeLine(index, recipe, weighed, mix, factor, share, contact, path);
      const nodePath = [...path, node.id];
      const nodeKey = `${key}${PATH_SEPARATOR}${node.id}`;
      const children =
        node.kind === 'recipe' && node.recipe
          ? expand(node.recipe, nodePath, nodeKey, factorBelow(index, node.recipe, node.massG), node.share, node.role === 'contact')
          : [];
      return { ...node, path: nodePath, key: nodeKey, children };
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

const NO_CHILDREN: LineNode[] = [];

/**
 * One merged line of `recipe` as a node at its place (`path` the ids down to the recipe): weighed,
 * scaled by `factor` and given its share of the product; a sub-recipe's children are the caller's.
 */
function placeLine(
  index: BookIndex,
  recipe: BookRecipe,
  weighed: Weighed,
  mix: number,
  factor: number,
  share: number,
  contact: boolean,
  path: string[],
): LineNode {
  const { line, ingredient, recipe: sub, grams } = weighed;
  const role: LineRole = contact || line.role === 'contact' ? 'contact' : 'ingredient';
  const usedG = role === 'contact' ? 0 : grams;
  const massG = usedG * factor;
  const nodeShare = mix > 0 ? (share * usedG) / mix : 0;
  if (ingredient) {
    return {
      kind: 'ingredient',
      id: ingredient.id,
      name: ingredient.name,
      role,
      usedG,
      massG,
      share: nodeShare,
      ingredient,
      children: NO_CHILDREN,
    };
  }
  if (!sub) throw new Error(`${recipe.name} uses '${line.use}', which is not in this book; check the book first.`);
  if (path.includes(sub.id)) throw new Error(`${sub.name} contains itself; check the book first.`);
  return { kind: 'recipe', id: sub.id, name: sub.name, role, usedG, massG, share: nodeShare, recipe: sub, children: NO_CHILDREN };
}

/** The factor a sub-recipe's lines are scaled by when `massG` of it reaches the product: massG / its batch. */
function factorBelow(index: BookIndex, sub: BookRecipe, massG: number): number {
  const batch = sub.finishedWeightG ?? mixOfRecipe(index, sub);
  return batch > 0 ? massG / batch : 0;
}

export interface Weighed {
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

/**
 * A node of a product as its declaration reads it (see TreeNode for its weights), without a path:
 * only the leaves need one (RolledLeaf).
 */
export interface LineNode {
  kind: 'ingredient' | 'recipe';
  id: string;
  name: string;
  /** 'contact' when this line or any line above it is a contact line. */
  role: LineRole;
  usedG: number;
  massG: number;
  share: number;
  ingredient?: BookIngredient;
  recipe?: BookRecipe;
  children: LineNode[];
}

/** A product's lines as its declaration reads them (a ProductTree is one too). */
export interface LineTree {
  recipe: BookRecipe;
  mixG: number;
  finishedG: number;
  children: LineNode[];
}

/** One leaf of a product: the ingredient it uses, its path from the product, and what reaches the product. */
export interface RolledLeaf<F> {
  /** What the ingredient brings wherever it is used. */
  facts: F;
  /**
   * Ids from the product down to the leaf. Two leaves with the same ids (a sub-recipe used once in
   * the mix and once by contact in one recipe) share one array, so a path is told apart by identity.
   */
  path: string[];
  /** The leaf or a line above it is a contact line. */
  contact: boolean;
  massG: number;
}

export interface RolledProduct<F> {
  tree: LineTree;
  /** Every leaf, depth first in line order (as leavesOf gives them). */
  leaves: RolledLeaf<F>[];
  /** Whether two leaves share a path (see RolledLeaf.path): only then can a path be met twice. */
  repeated: boolean;
}

function repeatsUse(index: BookIndex, recipe: BookRecipe): boolean {
  let repeats = index.repeats.get(recipe.id);
  if (repeats === undefined) {
    const uses = weighedLinesOf(index, recipe).map((l) => l.line.use);
    repeats = new Set(uses).size < uses.length;
    index.repeats.set(recipe.id, repeats);
  }
  return repeats;
}

/**
 * A product's lines and leaves in one walk, weighed as buildTree weighs them (the same figures,
 * worked out in the same order). `factsOf` gives an ingredient's facts (kept by the caller, once
 * per ingredient). The book must have passed checkBook.
 */
export function rollDown<F>(index: BookIndex, product: BookRecipe, factsOf: (ingredient: BookIngredient) => F): RolledProduct<F> {
  const leaves: RolledLeaf<F>[] = [];
  let repeated = false;
  /** `reuse`: the leaves of an earlier walk of the same item from the same place, whose paths this walk takes in turn. */
  const expand = (
    recipe: BookRecipe,
    path: string[],
    factor: number,
    share: number,
    contact: boolean,
    reuse: { at: number } | null,
  ): LineNode[] => {
    const lines = weighedLinesOf(index, recipe);
    const mix = mixOfRecipe(index, recipe);
    const firstAt = reuse === null && repeatsUse(index, recipe) ? new Map<string, number>() : null;
    const nodes: LineNode[] = new Array<LineNode>(lines.length);
    for (let n = 0; n < lines.length; n++) {
      const node = placeLine(index, recipe, lines[n], mix, factor, share, contact, path);
      nodes[n] = node;
      let from = reuse;
      if (firstAt) {
        const first = firstAt.get(node.id);
        if (first === undefined) firstAt.set(node.id, leaves.length);
        else {
          from = { at: first };
          repeated = true;
        }
      }
      const inContact = node.role === 'contact';
      if (node.ingredient) {
        const leafPath = from ? leaves[from.at++].path : [...path, node.id];
        leaves.push({ facts: factsOf(node.ingredient), path: leafPath, contact: inContact, massG: node.massG });
      } else if (node.recipe) {
        const factorOf = factorBelow(index, node.recipe, node.massG);
        node.children = expand(node.recipe, [...path, node.id], factorOf, node.share, inContact, from);
      }
    }
    return nodes;
  };
  const mixG = mixOfRecipe(index, product);
  const children = expand(product, [product.id], 1, 1, false, null);
  return { tree: { recipe: product, mixG, finishedG: product.finishedWeightG ?? mixG, children }, leaves, repeated };
}
