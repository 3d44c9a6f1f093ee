import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { IngredientView } from '@crumbproof/shared';
import { queryKeys, type IngredientSearch } from './query-keys';

/** Rows asked for at a time: a large kitchen's library comes in pages, not one long answer. */
export const INGREDIENT_PAGE_SIZE = 500;

function searchParams(search: IngredientSearch, offset: number): string {
  const params = new URLSearchParams({ limit: String(INGREDIENT_PAGE_SIZE), offset: String(offset) });
  if (search.q) params.set('q', search.q);
  if (search.source) params.set('source', search.source);
  return params.toString();
}

/**
 * The library, or the API's matches for a search (name, id, supplier and supplier code; the
 * allergen source an ingredient contains), read page by page until a page comes back short.
 */
export async function getIngredients(search: IngredientSearch = {}, { signal }: { signal?: AbortSignal } = {}): Promise<IngredientView[]> {
  const all: IngredientView[] = [];
  for (let offset = 0; ; offset += INGREDIENT_PAGE_SIZE) {
    const page = await apiClient.get<IngredientView[]>(`/ingredients?${searchParams(search, offset)}`, { signal });
    all.push(...page);
    if (page.length < INGREDIENT_PAGE_SIZE) return all;
  }
}

/** Every list the ingredient library, the recipe editor and the swap check read: one key a search, one shape. */
export function getIngredientsQueryOptions(search: IngredientSearch = {}) {
  return queryOptions({
    queryKey: queryKeys.ingredients.list(search),
    queryFn: ({ signal }) => getIngredients(search, { signal }),
  });
}

export function useIngredients({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getIngredientsQueryOptions(), enabled });
}

/** The API's matches for a search; while a new search is read, the last matches stay on screen. */
export function useIngredientSearch(search: IngredientSearch, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getIngredientsQueryOptions(search), enabled, placeholderData: keepPreviousData });
}
