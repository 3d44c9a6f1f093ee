import { mutationOptions, useMutation } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { SwapPreview, SwapRequest } from './types';

/** What every affected product would declare after the swap. Nothing is saved. */
export async function previewSwap(request: SwapRequest): Promise<SwapPreview> {
  return apiClient.post<SwapPreview>('/swaps/preview', request);
}

export function previewSwapMutationOptions() {
  return mutationOptions({ mutationKey: ['swaps', 'preview'], mutationFn: previewSwap });
}

export function usePreviewSwap() {
  return useMutation(previewSwapMutationOptions());
}
