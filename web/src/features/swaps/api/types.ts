import type { BookIngredient, BookRecipe, Declaration, DeclarationDiff } from '@crumbproof/shared';

export interface SwapRequest {
  from: string;
  to: string;
  /** One recipe; left out, every recipe that uses `from` directly. */
  recipe?: string;
}

export interface SwapProduct {
  product: string;
  name: string;
  before: Declaration;
  after: Declaration;
  diff: DeclarationDiff;
}

export interface SwapPreview {
  from: { id: string; name: string };
  to: { id: string; name: string };
  /** The recipes whose lines change; `lines` is how many lines of each. */
  recipes: { id: string; name: string; lines: number }[];
  products: SwapProduct[];
}

export interface SwapApplied {
  recipes: { id: string; revision: number }[];
}

/** The recipes and ingredients lists, as the API sends them (shared cache keys with the recipe pages). */
export type RecipeView = BookRecipe & { revision: number; updatedAt: string };
export type IngredientView = BookIngredient & { revision: number; updatedAt: string };
