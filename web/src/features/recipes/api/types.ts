import type { BookIngredient, BookRecipe, Declaration, DeclarationDiff, NutritionDeclaration } from '@crumbproof/shared';

/** A recipe as the API lists it: the book entry plus its current revision. */
export type RecipeView = BookRecipe & { revision: number; updatedAt: string };

export type IngredientView = BookIngredient & { revision: number; updatedAt: string };

/**
 * A product's declaration as the recipe routes send it. Nutrition is optional here so the page
 * still shows allergens and claims from an API that does not send it yet.
 */
export type DeclarationView = Declaration & { nutrition?: NutritionDeclaration | null };

export interface RecipeRevision {
  revision: number;
  note: string;
  authorName: string | null;
  createdAt: string;
  body: Omit<BookRecipe, 'id'>;
  declaration: Declaration | null;
  /** Against the previous revision; null for the first. */
  diff: DeclarationDiff | null;
}
