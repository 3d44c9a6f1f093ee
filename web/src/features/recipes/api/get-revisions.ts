import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { RecipeRevision } from './types';

export async function getRevisions(code: string, { signal }: { signal?: AbortSignal } = {}): Promise<RecipeRevision[]> {
  return apiClient.get<RecipeRevision[]>(`/recipes/${encodeURIComponent(code)}/revisions`, { signal });
}

export const revisionsQueryKey = (code: string) => ['recipes', code, 'revisions'] as const;

export function getRevisionsQueryOptions(code: string) {
  return queryOptions({ queryKey: revisionsQueryKey(code), queryFn: ({ signal }) => getRevisions(code, { signal }) });
}

/** Newest first. Only kitchen writers may read the history; pass enabled=false for the others. */
export function useRevisions(code: string, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getRevisionsQueryOptions(code), enabled });
}
