import { bookSchema, type Book, type BookInput, type Regime } from '@crumbproof/shared';

type IngredientInput = BookInput['ingredients'][number];
type RecipeInput = BookInput['recipes'][number];

/** A plain ingredient that is vegan, vegetarian and has a verified empty allergen list, unless overridden. */
export function ing(id: string, over: Partial<IngredientInput> = {}): IngredientInput {
  return { id, name: id.charAt(0).toUpperCase() + id.slice(1), contains: [], vegan: true, vegetarian: true, ...over };
}

/** A recipe from [use, grams] pairs (or full lines). */
export function recipe(
  id: string,
  lines: Array<[string, number] | RecipeInput['lines'][number]>,
  over: Partial<RecipeInput> = {},
): RecipeInput {
  return {
    id,
    name: id.charAt(0).toUpperCase() + id.slice(1),
    lines: lines.map((l) => (Array.isArray(l) ? { use: l[0], qty: l[1], unit: 'g' as const } : l)),
    ...over,
  };
}

/** A parsed book (through the real zod schema, so defaults apply as in production). */
export function book(
  ingredients: IngredientInput[],
  recipes: RecipeInput[],
  site: Partial<BookInput['site']> = {},
  regime: Regime = 'EU',
): Book {
  return bookSchema.parse({ crumbproofBook: 1, site: { name: 'Test bench', regime, handles: [], ...site }, ingredients, recipes });
}
