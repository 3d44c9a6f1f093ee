import type { SpecificationView } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** Every version of an ingredient's supplier specification, newest first. */
export async function getSpecifications(code: string, { signal }: { signal?: AbortSignal } = {}): Promise<SpecificationView[]> {
  return apiClient.get<SpecificationView[]>(`/ingredients/${encodeURIComponent(code)}/specifications`, { signal });
}

export function getSpecificationsQueryOptions(code: string) {
  return queryOptions({
    queryKey: queryKeys.ingredients.specifications(code),
    queryFn: ({ signal }) => getSpecifications(code, { signal }),
  });
}

export function useSpecifications(code: string) {
  return useQuery(getSpecificationsQueryOptions(code));
}
