import type { Declaration, NutritionDeclaration } from '@crumbproof/shared';

export type { IngredientView, RecipeView, RecipeRevisionView as RecipeRevision } from '@crumbproof/shared';

/**
 * A product's declaration as the recipe routes send it. Nutrition is optional here so the page
 * still shows allergens and claims from an API that does not send it yet.
 */
export type DeclarationView = Declaration & { nutrition?: NutritionDeclaration | null };
