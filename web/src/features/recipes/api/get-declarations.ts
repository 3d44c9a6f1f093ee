import type { Regime, ServedDeclaration } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** Declarations of every product for sale (sub-recipes have none). */
export async function getDeclarations(regime: Regime | undefined, { signal }: { signal?: AbortSignal } = {}): Promise<ServedDeclaration[]> {
  const query = regime ? `?regime=${regime}` : '';
  return apiClient.get<ServedDeclaration[]>(`/declarations${query}`, { signal });
}

export function getDeclarationsQueryOptions(regime: Regime | undefined) {
  return queryOptions({
    queryKey: queryKeys.declarations.products(regime),
    queryFn: ({ signal }) => getDeclarations(regime, { signal }),
  });
}

export function useDeclarations(regime: Regime | undefined, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getDeclarationsQueryOptions(regime), enabled });
}
