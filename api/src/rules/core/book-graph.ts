import type { Book, BookRecipe, UsedIn } from '@crumbproof/shared';

/** An ingredient or a recipe of the book, by its id. */
export interface BookItemRef {
  id: string;
  kind: 'ingredient' | 'recipe';
}

/**
 * Every item a product's declaration depends on, each once, in the order a walk down its lines
 * first reaches it: the product itself, then each line's item (a sub-recipe's own items straight
 * after it), then the items a recipe's sale details name for QUID (so a QUID that no longer
 * matches a line is declared with a warning, not read as a gap). Ids the book does not hold are
 * left out; a recipe met again (shared, or in a cycle) is not walked twice.
 */
export function closureItems(book: Book, productId: string): BookItemRef[] {
  const ingredients = new Set(book.ingredients.map((i) => i.id));
  const recipes = new Map(book.recipes.map((r) => [r.id, r]));
  const seen = new Set<string>();
  const out: BookItemRef[] = [];
  const visit = (id: string) => {
    if (seen.has(id)) return;
    if (ingredients.has(id)) {
      seen.add(id);
      out.push({ id, kind: 'ingredient' });
      return;
    }
    const recipe = recipes.get(id);
    if (!recipe) return;
    seen.add(id);
    out.push({ id, kind: 'recipe' });
    for (const line of recipe.lines) visit(line.use);
    for (const named of recipe.sale?.quid ?? []) visit(named);
  };
  visit(productId);
  return out;
}

/** The part of the book a product's declaration is computed from: the site, and the items of its closure in the book's order. */
export function closureOf(book: Book, productId: string): Book {
  const reached = new Set(closureItems(book, productId).map((i) => i.id));
  return {
    ...book,
    ingredients: book.ingredients.filter((i) => reached.has(i.id)),
    recipes: book.recipes.filter((r) => reached.has(r.id)),
  };
}

/** The closures of a book's products (closureItems, closureOf), for many products of one book. */
export interface BookClosures {
  /** closureItems(book, productId). */
  items(productId: string): readonly BookItemRef[];
  /** closureOf(book, productId). */
  of(productId: string): Book;
}

/**
 * closureItems and closureOf of many products of one book, from one index of the book and each
 * recipe's items worked out once, however many products reach it. Where no recipe contains itself
 * and every id is used once, a walk down a recipe's lines reaches, after the recipe, each line's
 * items in turn as that line's item alone reaches them, less those reached before (whatever a
 * recipe reaches is reached in full before the walk moves on): so a recipe's items are itself,
 * then its lines' and QUID items' items, each once. In a book with a cycle or a repeated id
 * (which checkBook refuses) each product is walked on its own, as closureItems does.
 */
export function bookClosures(book: Book): BookClosures {
  const ingredients = new Map(book.ingredients.map((i, n) => [i.id, n]));
  const recipes = new Map(book.recipes.map((r, n) => [r.id, n]));
  let alone = ingredients.size + recipes.size !== new Set([...ingredients.keys(), ...recipes.keys()]).size;
  alone ||= ingredients.size !== book.ingredients.length || recipes.size !== book.recipes.length;
  const known = new Map<string, readonly BookItemRef[]>();
  const open = new Set<string>();
  const NONE: readonly BookItemRef[] = [];
  // Null when the walk meets a recipe it is inside of (a cycle).
  const itemsOf = (id: string): readonly BookItemRef[] | null => {
    const done = known.get(id);
    if (done) return done;
    if (ingredients.has(id)) {
      const one = [{ id, kind: 'ingredient' as const }];
      known.set(id, one);
      return one;
    }
    const at = recipes.get(id);
    if (at === undefined) return NONE;
    if (open.has(id)) return null;
    open.add(id);
    const recipe = book.recipes[at];
    const out: BookItemRef[] = [{ id, kind: 'recipe' }];
    const seen = new Set([id]);
    for (const use of [...recipe.lines.map((l) => l.use), ...(recipe.sale?.quid ?? [])]) {
      const below = itemsOf(use);
      if (below === null) return null;
      for (const item of below) {
        if (seen.has(item.id)) continue;
        seen.add(item.id);
        out.push(item);
      }
    }
    open.delete(id);
    known.set(id, out);
    return out;
  };
  const items = (productId: string): readonly BookItemRef[] => {
    if (!alone) {
      const found = itemsOf(productId);
      if (found) return found;
      alone = true;
    }
    return closureItems(book, productId);
  };
  return {
    items,
    of(productId) {
      if (alone) return closureOf(book, productId);
      const reached = items(productId);
      if (alone) return closureOf(book, productId);
      const positions = (kind: BookItemRef['kind'], index: Map<string, number>) =>
        reached
          .filter((i) => i.kind === kind)
          .map((i) => index.get(i.id)!)
          .sort((a, b) => a - b);
      return {
        ...book,
        ingredients: positions('ingredient', ingredients).map((n) => book.ingredients[n]),
        recipes: positions('recipe', recipes).map((n) => book.recipes[n]),
      };
    },
  };
}

/** The ids of every recipe that uses the item at any depth, through its lines. */
export function recipesAbove(book: Pick<Book, 'recipes'>, itemId: string): Set<string> {
  return recipesAboveAny(book, [itemId]);
}

/** By item id, the ids of the recipes whose lines use it. */
export type UsersIndex = Map<string, Set<string>>;

/** Who uses each item, from every recipe's lines. */
export function usersOf(book: Pick<Book, 'recipes'>): UsersIndex {
  const users: UsersIndex = new Map();
  for (const r of book.recipes) addUses(users, r);
  return users;
}

/** Adds a recipe's lines to a users index (removeUses takes them out again). */
export function addUses(users: UsersIndex, recipe: Pick<BookRecipe, 'id' | 'lines'>): void {
  for (const line of recipe.lines) {
    let of = users.get(line.use);
    if (!of) users.set(line.use, (of = new Set()));
    of.add(recipe.id);
  }
}

export function removeUses(users: UsersIndex, recipe: Pick<BookRecipe, 'id' | 'lines'>): void {
  for (const line of recipe.lines) users.get(line.use)?.delete(recipe.id);
}

/**
 * The ids of every recipe that uses any of the items at any depth: one walk of the book however
 * many items (`users`, when given, is the book's index of who uses what).
 */
export function recipesAboveAny(book: Pick<Book, 'recipes'>, itemIds: Iterable<string>, users: UsersIndex = usersOf(book)): Set<string> {
  const above = new Set<string>();
  const todo = [...itemIds];
  while (todo.length > 0) {
    for (const user of users.get(todo.pop()!) ?? []) {
      if (above.has(user)) continue;
      above.add(user);
      todo.push(user);
    }
  }
  return above;
}

/**
 * Every recipe that uses an item at any depth, in the book's order, with each path of ids from
 * the recipe down to the item. A path passes through a recipe at most once (so a cycle, which the
 * book check refuses anyway, cannot make it endless); two lines of one recipe using the same item
 * are one path, since a path names items, not lines.
 */
export function usedIn(book: Book, itemId: string): UsedIn[] {
  const recipes = new Map(book.recipes.map((r) => [r.id, r]));
  const above = recipesAbove(book, itemId);
  // The paths below a recipe that lies on no cycle are the same from wherever it is reached, so
  // they are worked out once: shared sub-recipes (diamonds) and deep chains stay linear.
  const settled = new Map<string, string[][]>();
  const pathsFrom = (recipeId: string, onPath: Set<string>): { paths: string[][]; cut: boolean } => {
    const known = settled.get(recipeId);
    if (known) return { paths: known, cut: false };
    const paths: string[][] = [];
    let cut = false;
    for (const use of new Set(recipes.get(recipeId)!.lines.map((l) => l.use))) {
      if (use === itemId) paths.push([recipeId, itemId]);
      // Only into sub-recipes that lead to the item: every step taken ends in a path.
      else if (!above.has(use)) continue;
      else if (onPath.has(use)) cut = true;
      else {
        onPath.add(use);
        const below = pathsFrom(use, onPath);
        onPath.delete(use);
        cut ||= below.cut;
        for (const p of below.paths) paths.push([recipeId, ...p]);
      }
    }
    // A walk cut short by a recipe already on the path depends on that path: not kept.
    if (!cut) settled.set(recipeId, paths);
    return { paths, cut };
  };
  return book.recipes
    .filter((r) => above.has(r.id))
    .map((r) => ({ id: r.id, name: r.name, forSale: Boolean(r.sale), paths: pathsFrom(r.id, new Set([r.id])).paths }))
    .filter((u) => u.paths.length > 0);
}
