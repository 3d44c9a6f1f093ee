import type { Book, UsedIn } from '@crumbproof/shared';

/** Every recipe that uses an item at any depth, with each path that reaches it. */
export function usedIn(book: Book, itemId: string): UsedIn[] {
  const byId = new Map(book.recipes.map((r) => [r.id, r]));
  const memo = new Map<string, string[][]>();
  const pathsFrom = (recipeId: string, stack: Set<string>): string[][] => {
    if (memo.has(recipeId)) return memo.get(recipeId)!;
    const recipe = byId.get(recipeId)!;
    const out: string[][] = [];
    for (const line of recipe.lines) {
      if (line.use === itemId) out.push([recipeId, itemId]);
      else if (byId.has(line.use) && !stack.has(line.use)) {
        stack.add(line.use);
        for (const p of pathsFrom(line.use, stack)) out.push([recipeId, ...p]);
        stack.delete(line.use);
      }
    }
    memo.set(recipeId, out);
    return out;
  };
  return book.recipes
    .map((r) => ({ id: r.id, name: r.name, forSale: Boolean(r.sale), paths: pathsFrom(r.id, new Set([r.id])) }))
    .filter((u) => u.paths.length > 0);
}
