import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { IngredientView } from '@crumbproof/shared';

/** Every list the ingredient library, the recipe editor and the swap check read: one key, one shape. */
export const ingredientsQueryKey = ['ingredients'] as const;

/** Rows asked for at a time: a large kitchen's library comes in pages, not one long answer. */
export const INGREDIENT_PAGE_SIZE = 500;

/** The whole library, read page by page from the API until a page comes back short. */
export async function getIngredients({ signal }: { signal?: AbortSignal } = {}): Promise<IngredientView[]> {
  const all: IngredientView[] = [];
  for (let offset = 0; ; offset += INGREDIENT_PAGE_SIZE) {
    const page = await apiClient.get<IngredientView[]>(`/ingredients?limit=${INGREDIENT_PAGE_SIZE}&offset=${offset}`, { signal });
    // An answer longer than a page means the list came whole (the server did not page it).
    if (page.length > INGREDIENT_PAGE_SIZE) return page;
    all.push(...page);
    if (page.length < INGREDIENT_PAGE_SIZE) return all;
  }
}

export function getIngredientsQueryOptions() {
  return queryOptions({
    queryKey: ingredientsQueryKey,
    queryFn: ({ signal }) => getIngredients({ signal }),
  });
}

export function useIngredients({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getIngredientsQueryOptions(), enabled });
}
