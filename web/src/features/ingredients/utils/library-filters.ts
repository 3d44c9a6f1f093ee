import type { AllergenSource } from '@crumbproof/shared';
import type { IngredientView, SpecificationState } from '../api/types';
import { missingDataOf, sourceOf, type MissingData } from './ingredient-facts';

/** One row of the library: the ingredient and what the library knows about it. */
export interface LibraryRow {
  ingredient: IngredientView;
  /** undefined while the specification status is not loaded (or could not be). */
  specification: SpecificationState | undefined;
  specificationReviewBy: string | undefined;
  missing: MissingData[];
}

export function toLibraryRows(
  ingredients: readonly IngredientView[],
  status: ReadonlyMap<string, { state: SpecificationState; reviewBy?: string }> | undefined,
): LibraryRow[] {
  return ingredients.map((ingredient) => {
    const spec = status?.get(ingredient.id);
    const specification = status ? (spec?.state ?? 'missing') : undefined;
    return {
      ingredient,
      specification,
      specificationReviewBy: spec?.reviewBy,
      missing: missingDataOf(ingredient, specification),
    };
  });
}

export type DietaryFilter = '' | `${'vegan' | 'vegetarian'}-${'yes' | 'no' | 'unknown'}`;
export type SpecificationFilter = '' | 'missing' | 'overdue' | 'current';
export type MissingFilter = '' | 'any' | MissingData;

export interface LibraryFilters {
  search: string;
  source: AllergenSource | '';
  dietary: DietaryFilter;
  specification: SpecificationFilter;
  missing: MissingFilter;
}

export const NO_FILTERS: LibraryFilters = { search: '', source: '', dietary: '', specification: '', missing: '' };

function matchesDietary(row: LibraryRow, filter: DietaryFilter): boolean {
  if (filter === '') return true;
  const [claim, answer] = filter.split('-') as ['vegan' | 'vegetarian', 'yes' | 'no' | 'unknown'];
  const value = row.ingredient[claim];
  if (answer === 'yes') return value === true;
  if (answer === 'no') return value === false;
  return value === null || value === undefined;
}

/** Search looks in the name, supplier, supplier code and id. */
export function filterLibrary(rows: readonly LibraryRow[], filters: LibraryFilters): LibraryRow[] {
  const words = filters.search.trim().toLocaleLowerCase('en-GB').split(/\s+/).filter(Boolean);
  return rows.filter((row) => {
    const { ingredient } = row;
    if (words.length > 0) {
      const haystack = [ingredient.name, ingredient.supplier, ingredient.supplierCode, ingredient.id]
        .filter(Boolean)
        .join(' ')
        .toLocaleLowerCase('en-GB');
      if (!words.every((word) => haystack.includes(word))) return false;
    }
    if (filters.source !== '' && !(ingredient.contains ?? []).some((entry) => sourceOf(entry) === filters.source)) return false;
    if (!matchesDietary(row, filters.dietary)) return false;
    if (filters.specification !== '' && row.specification !== filters.specification) return false;
    if (filters.missing === 'any' && row.missing.length === 0) return false;
    if (filters.missing !== '' && filters.missing !== 'any' && !row.missing.includes(filters.missing)) return false;
    return true;
  });
}
