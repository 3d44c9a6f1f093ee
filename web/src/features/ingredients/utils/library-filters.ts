import type { AllergenSource, IngredientView, SpecificationState, SpecificationStatus } from '@crumbproof/shared';
import type { IngredientSearch } from '@/api/query-keys';
import { missingDataOf, type MissingData } from './ingredient-facts';

/** One row of the library: the ingredient and what the library knows about it. */
export interface LibraryRow {
  ingredient: IngredientView;
  /** undefined while the specification status is not loaded (or could not be). */
  specification: SpecificationState | undefined;
  missing: MissingData[];
}

/** Each ingredient with its specification state; the status is by ingredient id, undefined when not known. */
export function toLibraryRows(
  ingredients: readonly IngredientView[],
  status: ReadonlyMap<string, SpecificationStatus> | undefined,
): LibraryRow[] {
  return ingredients.map((ingredient) => {
    const specification = status ? (status.get(ingredient.id)?.state ?? 'missing') : undefined;
    return { ingredient, specification, missing: missingDataOf(ingredient, specification) };
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

/** The part of the filters the API answers: the search words and the allergen source contained. */
export function searchOf(filters: LibraryFilters): IngredientSearch {
  const q = filters.search.trim();
  return { ...(q ? { q } : {}), ...(filters.source ? { source: filters.source } : {}) };
}

/** The rest, on the rows the API returned: dietary status, specification state, data missing. */
export function filterLibrary(rows: readonly LibraryRow[], filters: LibraryFilters): LibraryRow[] {
  return rows.filter((row) => {
    if (!matchesDietary(row, filters.dietary)) return false;
    if (filters.specification !== '' && row.specification !== filters.specification) return false;
    if (filters.missing === 'any' && row.missing.length === 0) return false;
    if (filters.missing !== '' && filters.missing !== 'any' && !row.missing.includes(filters.missing)) return false;
    return true;
  });
}
