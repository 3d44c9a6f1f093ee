import type { CompositionScan, CompositionScanRequest } from '@crumbproof/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** The terms the rules engine finds in a supplier's composition text. Nothing is saved. */
export async function scanComposition(
  request: CompositionScanRequest,
  { signal }: { signal?: AbortSignal } = {},
): Promise<CompositionScan> {
  return apiClient.post<CompositionScan>('/composition/scan', request, { signal });
}

export function scanCompositionQueryOptions(request: CompositionScanRequest) {
  return queryOptions({
    queryKey: queryKeys.reference.compositionScan(request),
    queryFn: ({ signal }) => scanComposition(request, { signal }),
    // The scan depends on the text and the reference lexicon only.
    staleTime: Infinity,
  });
}

/** Pass the debounced text; an empty text asks nothing. */
export function useCompositionScan(request: CompositionScanRequest) {
  return useQuery({
    ...scanCompositionQueryOptions(request),
    enabled: request.text.trim() !== '',
    placeholderData: keepPreviousData,
  });
}
