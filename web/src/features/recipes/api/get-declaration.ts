import type { Regime } from '@crumbproof/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { DeclarationView } from './types';

export async function getDeclaration(
  code: string,
  regime: Regime | undefined,
  { signal }: { signal?: AbortSignal } = {},
): Promise<DeclarationView> {
  const query = regime ? `?regime=${regime}` : '';
  return apiClient.get<DeclarationView>(`/recipes/${encodeURIComponent(code)}/declaration${query}`, { signal });
}

/** Every regime of one product sits under this prefix, so saving the recipe invalidates them all. */
export const declarationQueryPrefix = (code: string) => ['recipes', code, 'declaration'] as const;
export const declarationQueryKey = (code: string, regime: Regime | undefined) =>
  [...declarationQueryPrefix(code), regime ?? 'kitchen'] as const;

export function getDeclarationQueryOptions(code: string, regime: Regime | undefined) {
  return queryOptions({
    queryKey: declarationQueryKey(code, regime),
    queryFn: ({ signal }) => getDeclaration(code, regime, { signal }),
  });
}

export function useDeclaration(code: string, regime: Regime | undefined, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getDeclarationQueryOptions(code, regime), enabled, placeholderData: keepPreviousData });
}
