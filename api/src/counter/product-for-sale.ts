import type { Book } from '@crumbproof/shared';

/** What is wrong with an id given as a product on the counter (none, or a recipe not for sale), or null. */
export function notForSale(book: Book, id: string): string | null {
  const recipe = book.recipes.find((r) => r.id === id);
  if (!recipe) return `There is no product '${id}'.`;
  if (!recipe.sale) return `${recipe.name} ('${id}') is a recipe, not for sale.`;
  return null;
}
