import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { SpecificationStatus } from './types';

/** For every ingredient: its newest specification and whether it is missing, overdue or current. */
export async function getSpecificationStatus({ signal }: { signal?: AbortSignal } = {}): Promise<SpecificationStatus[]> {
  return apiClient.get<SpecificationStatus[]>('/specifications/status', { signal });
}

export const specificationStatusQueryKey = ['specifications', 'status'] as const;

export function getSpecificationStatusQueryOptions() {
  return queryOptions({
    queryKey: specificationStatusQueryKey,
    queryFn: ({ signal }) => getSpecificationStatus({ signal }),
  });
}

export function useSpecificationStatus() {
  return useQuery(getSpecificationStatusQueryOptions());
}
