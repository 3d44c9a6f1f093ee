import type { RecipeRevisionView } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export async function getRevisions(code: string, { signal }: { signal?: AbortSignal } = {}): Promise<RecipeRevisionView[]> {
  return apiClient.get<RecipeRevisionView[]>(`/recipes/${encodeURIComponent(code)}/revisions`, { signal });
}

export function getRevisionsQueryOptions(code: string) {
  return queryOptions({ queryKey: queryKeys.recipes.revisions(code), queryFn: ({ signal }) => getRevisions(code, { signal }) });
}

/** Newest first. Only kitchen writers may read the history; pass enabled=false for the others. */
export function useRevisions(code: string, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getRevisionsQueryOptions(code), enabled });
}
