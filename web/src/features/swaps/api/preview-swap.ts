import type { SwapPreview, SwapRequest } from '@crumbproof/shared';
import { mutationOptions, useMutation } from '@tanstack/react-query';
import { mutationKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** What every affected product would declare after the swap. Nothing is saved. */
export async function previewSwap(request: SwapRequest): Promise<SwapPreview> {
  return apiClient.post<SwapPreview>('/swaps/preview', request);
}

export function previewSwapMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.previewSwap(), mutationFn: previewSwap });
}

export function usePreviewSwap() {
  return useMutation(previewSwapMutationOptions());
}
