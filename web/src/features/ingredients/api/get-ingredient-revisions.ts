import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { ingredientQueryKey } from './get-ingredient';
import type { IngredientRevision } from './types';

export async function getIngredientRevisions(code: string, { signal }: { signal?: AbortSignal } = {}): Promise<IngredientRevision[]> {
  return apiClient.get<IngredientRevision[]>(`/ingredients/${encodeURIComponent(code)}/revisions`, { signal });
}

export function getIngredientRevisionsQueryOptions(code: string) {
  return queryOptions({
    queryKey: [...ingredientQueryKey(code), 'revisions'] as const,
    queryFn: ({ signal }) => getIngredientRevisions(code, { signal }),
  });
}

export function useIngredientRevisions(code: string) {
  return useQuery(getIngredientRevisionsQueryOptions(code));
}
