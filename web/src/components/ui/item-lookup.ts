import type { Declaration, DeclaredIngredient, ProductDeclaration } from '@crumbproof/shared';
import type { ItemInfo, ItemLookup } from './layer-path';

interface LookupSources {
  recipes?: readonly { id: string; name: string }[] | undefined;
  ingredients?: readonly { id: string; name: string }[] | undefined;
  /** Declarations with nutrition (a product's) or without (a swap's before and after); undefined while loading. */
  declarations?: readonly (Declaration | ProductDeclaration | undefined)[];
}

function walk(items: readonly DeclaredIngredient[], into: Map<string, ItemInfo>) {
  for (const item of items) {
    if (!into.has(item.id)) into.set(item.id, { name: item.name, kind: item.kind });
    walk(item.children, into);
  }
}

/**
 * Names and kinds of every id a screen may show, from what it already has: the recipes list,
 * the ingredients list (writers only) and the declarations themselves (their ingredient trees,
 * unknown and exempt leaves, nutrition sources), so front of house sees names too.
 */
export function buildItemLookup({ recipes = [], ingredients = [], declarations = [] }: LookupSources): ItemLookup {
  const index = new Map<string, ItemInfo>();
  for (const recipe of recipes) index.set(recipe.id, { name: recipe.name, kind: 'recipe' });
  for (const ingredient of ingredients) index.set(ingredient.id, { name: ingredient.name, kind: 'ingredient' });
  for (const declaration of declarations) {
    if (!declaration) continue;
    if (!index.has(declaration.product)) index.set(declaration.product, { name: declaration.name, kind: 'recipe' });
    walk(declaration.ingredients, index);
    for (const unknown of declaration.unknown) {
      if (!index.has(unknown.ingredient)) index.set(unknown.ingredient, { name: unknown.name, kind: 'ingredient' });
    }
    for (const exempt of declaration.exempt) {
      if (!index.has(exempt.ingredient)) index.set(exempt.ingredient, { name: exempt.name, kind: 'ingredient' });
    }
    for (const source of 'nutrition' in declaration ? declaration.nutrition.sources : []) {
      if (!index.has(source.id)) index.set(source.id, { name: source.name, kind: 'ingredient' });
    }
  }
  return (id) => index.get(id);
}
