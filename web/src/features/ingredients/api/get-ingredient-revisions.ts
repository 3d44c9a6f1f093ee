import type { IngredientRevisionView } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export async function getIngredientRevisions(code: string, { signal }: { signal?: AbortSignal } = {}): Promise<IngredientRevisionView[]> {
  return apiClient.get<IngredientRevisionView[]>(`/ingredients/${encodeURIComponent(code)}/revisions`, { signal });
}

export function getIngredientRevisionsQueryOptions(code: string) {
  return queryOptions({
    queryKey: queryKeys.ingredients.revisions(code),
    queryFn: ({ signal }) => getIngredientRevisions(code, { signal }),
  });
}

export function useIngredientRevisions(code: string) {
  return useQuery(getIngredientRevisionsQueryOptions(code));
}
