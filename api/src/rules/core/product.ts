import type { Book, ProductDeclaration, Regime } from '@crumbproof/shared';
import { declare } from './declare';
import { computeNutrition } from './nutrition';
import { defaultMeasures } from './quantities';
import type { ReferenceData } from './reference-schema';
import { nutritionLimitWarnings } from './sanity';

/**
 * Changes whenever the engine's output changes shape or meaning, so that declarations kept in
 * the database are computed again rather than served stale.
 */
export const ENGINE_VERSION = 10;

/** A product's full declaration: allergens, claims and list (declare) with its nutrition. */
export function declareProduct(book: Book, productId: string, refs: ReferenceData, opts: { regime?: Regime } = {}): ProductDeclaration {
  const regime = opts.regime ?? book.site.regime;
  const declaration = declare(book, productId, refs, { regime });
  const nutrition = computeNutrition(book, productId, { regime, measures: book.site.measures ?? defaultMeasures(regime) });
  const warnings = [...declaration.warnings, ...nutritionLimitWarnings(declaration.name, nutrition.per100g)];
  return { ...declaration, warnings, nutrition };
}

/** Every product for sale in the book, in book order. */
export function declareProducts(book: Book, refs: ReferenceData, opts: { regime?: Regime } = {}): { declarations: ProductDeclaration[] } {
  return { declarations: book.recipes.filter((r) => r.sale).map((r) => declareProduct(book, r.id, refs, opts)) };
}
