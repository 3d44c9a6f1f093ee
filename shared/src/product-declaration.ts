import type { Declaration } from './declaration';
import type { NutritionDeclaration } from './nutrition';

/** What the API, the command line and the labels give for a product: allergens, claims, list and nutrition. */
export interface ProductDeclaration extends Declaration {
  nutrition: NutritionDeclaration;
}
