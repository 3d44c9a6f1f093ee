import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { SwapApplied, SwapRequest } from './types';

/** Writes a new revision of every changed recipe, all or nothing. */
export async function applySwap(request: SwapRequest): Promise<SwapApplied> {
  return apiClient.post<SwapApplied>('/swaps/apply', request);
}

export function applySwapMutationOptions() {
  return mutationOptions({ mutationKey: ['swaps', 'apply'], mutationFn: applySwap });
}

export function useApplySwap() {
  const queryClient = useQueryClient();
  return useMutation({
    ...applySwapMutationOptions(),
    onSuccess: () => {
      // Every recipe, its declaration and history live under ['recipes']; product declarations under ['declarations'].
      void queryClient.invalidateQueries({ queryKey: ['recipes'] });
      void queryClient.invalidateQueries({ queryKey: ['declarations'] });
    },
  });
}
