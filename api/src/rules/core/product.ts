import type { Book, Declaration, NutritionDeclaration, ProductDeclaration, Regime } from '@crumbproof/shared';
import { checkBook } from './book-check';
import { closureOf } from './book-graph';
import { declare, declarerOfChecked } from './declare';
import { computeNutrition, nutritionOf, NutritionRoller } from './nutrition';
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
  return withNutrition(declaration, computeNutrition(book, productId, { regime, measures: book.site.measures ?? defaultMeasures(regime) }));
}

function withNutrition(declaration: Declaration, nutrition: NutritionDeclaration): ProductDeclaration {
  const warnings = [...declaration.warnings, ...nutritionLimitWarnings(declaration.name, nutrition.per100g)];
  return { ...declaration, warnings, nutrition };
}

/** Every product for sale in the book, in book order. */
export function declareProducts(book: Book, refs: ReferenceData, opts: { regime?: Regime } = {}): { declarations: ProductDeclaration[] } {
  return { declarations: book.recipes.filter((r) => r.sale).map((r) => declareProduct(book, r.id, refs, opts)) };
}

/**
 * Declares recipes of one book under one regime, one at a time, each exactly as declareProduct
 * gives it on the recipe's own closure (`declareProduct(closureOf(book, id), id, refs, opts)`,
 * what a kept declaration is computed from), throwing where that throws. The book is checked
 * once and every recipe shares one run and one nutrition rollup, so a sub-recipe used by many
 * is worked out once: a clean book's closure holds every item a recipe reaches and nothing its
 * declaration reads beyond them (the site), so the whole book declares it alike. A book with
 * problems declares each recipe on its own closure, which may have none.
 */
export function productDeclarer(
  book: Book,
  refs: ReferenceData,
  opts: { regime?: Regime } = {},
): (productId: string) => ProductDeclaration {
  const regime = opts.regime ?? book.site.regime;
  if (checkBook(book).length > 0) return (id) => declareProduct(closureOf(book, id), id, refs, { regime });
  const declareOne = declarerOfChecked(book, refs, regime);
  const roller = new NutritionRoller(book, book.site.measures ?? defaultMeasures(regime));
  return (id) => {
    const declaration = declareOne(id);
    return withNutrition(declaration, nutritionOf(roller, id, regime));
  };
}

/** Each recipe's declaration as productDeclarer gives it, in the order given. */
export function declareEach(book: Book, ids: readonly string[], refs: ReferenceData, opts: { regime?: Regime } = {}): ProductDeclaration[] {
  const declareOne = productDeclarer(book, refs, opts);
  return ids.map((id) => declareOne(id));
}
