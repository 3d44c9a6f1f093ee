import type { NutrientReference } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export async function getNutrientReference({ signal }: { signal?: AbortSignal } = {}): Promise<NutrientReference> {
  return apiClient.get<NutrientReference>('/reference/nutrients', { signal });
}

export function getNutrientReferenceQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.reference.nutrients(),
    queryFn: ({ signal }) => getNutrientReference({ signal }),
    // Reference data changes only with a new release of Crumbproof.
    staleTime: Infinity,
  });
}

export function useNutrientReference({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getNutrientReferenceQueryOptions(), enabled });
}
