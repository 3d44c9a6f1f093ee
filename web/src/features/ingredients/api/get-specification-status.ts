import type { SpecificationStatus } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** For every ingredient: its newest specification and whether it is missing, overdue or current. */
export async function getSpecificationStatus({ signal }: { signal?: AbortSignal } = {}): Promise<SpecificationStatus[]> {
  return apiClient.get<SpecificationStatus[]>('/specifications/status', { signal });
}

export function getSpecificationStatusQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.specifications.status(),
    queryFn: ({ signal }) => getSpecificationStatus({ signal }),
  });
}

export function useSpecificationStatus() {
  return useQuery(getSpecificationStatusQueryOptions());
}
