import type { Regime, ServedDeclaration } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from './query-keys';
import { apiClient } from '@/lib/api-client';

/** A product's declaration as the API serves it, with what it was worked out from. */
export async function getDeclaration(
  code: string,
  regime: Regime | undefined,
  { signal }: { signal?: AbortSignal } = {},
): Promise<ServedDeclaration> {
  const query = regime ? `?regime=${regime}` : '';
  return apiClient.get<ServedDeclaration>(`/recipes/${encodeURIComponent(code)}/declaration${query}`, { signal });
}

export function getDeclarationQueryOptions(code: string, regime: Regime | undefined) {
  return queryOptions({
    queryKey: queryKeys.declarations.product(code, regime),
    queryFn: ({ signal }) => getDeclaration(code, regime, { signal }),
  });
}

/**
 * No earlier answer stands in while another regime's declaration is read: a declaration is
 * shown only for the product and regime it was worked out for.
 */
export function useDeclaration(code: string, regime: Regime | undefined, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getDeclarationQueryOptions(code, regime), enabled });
}
