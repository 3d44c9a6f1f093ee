import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { NutrientReference } from './types';

export async function getNutrientReference({ signal }: { signal?: AbortSignal } = {}): Promise<NutrientReference> {
  return apiClient.get<NutrientReference>('/reference/nutrients', { signal });
}

export function getNutrientReferenceQueryOptions() {
  return queryOptions({
    queryKey: ['reference', 'nutrients'] as const,
    queryFn: ({ signal }) => getNutrientReference({ signal }),
    staleTime: Infinity,
  });
}

export function useNutrientReference({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getNutrientReferenceQueryOptions(), enabled });
}
