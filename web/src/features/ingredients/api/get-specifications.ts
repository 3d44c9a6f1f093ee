import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { ingredientQueryKey } from './get-ingredient';
import type { Specification } from './types';

/** Every version of an ingredient's supplier specification, newest first. */
export async function getSpecifications(code: string, { signal }: { signal?: AbortSignal } = {}): Promise<Specification[]> {
  return apiClient.get<Specification[]>(`/ingredients/${encodeURIComponent(code)}/specifications`, { signal });
}

export const specificationsQueryKey = (code: string) => [...ingredientQueryKey(code), 'specifications'] as const;

export function getSpecificationsQueryOptions(code: string) {
  return queryOptions({
    queryKey: specificationsQueryKey(code),
    queryFn: ({ signal }) => getSpecifications(code, { signal }),
  });
}

export function useSpecifications(code: string) {
  return useQuery(getSpecificationsQueryOptions(code));
}

export function specificationFileUrl(spec: Pick<Specification, 'id' | 'fileUrl'>): string {
  return spec.fileUrl ?? `/api/specifications/${spec.id}/file`;
}
