import type { SourceEntry } from '@crumbproof/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { CompositionScan } from './types';

export interface ScanCompositionInput {
  text: string;
  /** The supplier's contains list; left out when there is no allergen statement. */
  contains?: SourceEntry[];
}

/** The terms the rules engine finds in a supplier's composition text. Nothing is saved. */
export async function scanComposition(input: ScanCompositionInput, { signal }: { signal?: AbortSignal } = {}): Promise<CompositionScan> {
  const scan = await apiClient.post<Partial<CompositionScan>>('/composition/scan', input, { signal });
  return {
    allergens: scan.allergens ?? [],
    precautionary: scan.precautionary ?? [],
    animal: scan.animal ?? [],
    vague: scan.vague ?? [],
    discrepancies: scan.discrepancies ?? [],
  };
}

export function scanCompositionQueryOptions(input: ScanCompositionInput) {
  return queryOptions({
    queryKey: ['composition-scan', input.text, input.contains ?? null] as const,
    queryFn: ({ signal }) => scanComposition(input, { signal }),
    staleTime: Infinity,
  });
}

/** Pass the debounced text; an empty text asks nothing. */
export function useCompositionScan(input: ScanCompositionInput) {
  return useQuery({
    ...scanCompositionQueryOptions(input),
    enabled: input.text.trim() !== '',
    placeholderData: keepPreviousData,
  });
}
