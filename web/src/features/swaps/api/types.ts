export type { IngredientView, RecipeView, SwapApplied, SwapPreview, SwapProduct, SwapRequest } from '@crumbproof/shared';
