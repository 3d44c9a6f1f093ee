import type { Regime } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { DeclarationView } from './types';

/** Declarations of every product for sale (sub-recipes have none). */
export async function getDeclarations(regime: Regime | undefined, { signal }: { signal?: AbortSignal } = {}): Promise<DeclarationView[]> {
  const query = regime ? `?regime=${regime}` : '';
  return apiClient.get<DeclarationView[]>(`/declarations${query}`, { signal });
}

export const declarationsQueryPrefix = ['declarations', 'products'] as const;
export const declarationsQueryKey = (regime: Regime | undefined) => [...declarationsQueryPrefix, regime ?? 'kitchen'] as const;

export function getDeclarationsQueryOptions(regime: Regime | undefined) {
  return queryOptions({
    queryKey: declarationsQueryKey(regime),
    queryFn: ({ signal }) => getDeclarations(regime, { signal }),
  });
}

export function useDeclarations(regime: Regime | undefined, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getDeclarationsQueryOptions(regime), enabled });
}
