import type { SpecificationView } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { refreshAfterKitchenWrite } from '@/api/kitchen-writes';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export const SPECIFICATION_MAX_BYTES = 10 * 1024 * 1024;

export interface UploadSpecificationInput {
  code: string;
  file: File;
  /** YYYY-MM-DD, today or later; empty, the API gives one year from today. */
  reviewBy: string;
  note?: string;
}

export async function uploadSpecification({ code, file, reviewBy, note }: UploadSpecificationInput): Promise<SpecificationView> {
  const form = new FormData();
  if (reviewBy !== '') form.append('reviewBy', reviewBy);
  if (note && note.trim() !== '') form.append('note', note.trim());
  // The file goes last so the API has read the fields before the bytes arrive.
  form.append('file', file, file.name);
  return apiClient.post<SpecificationView>(`/ingredients/${encodeURIComponent(code)}/specifications`, form);
}

export function uploadSpecificationMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.uploadSpecification(), mutationFn: uploadSpecification });
}

/** A new specification changes the ingredient's specification state wherever it is shown. */
export function useUploadSpecification() {
  const queryClient = useQueryClient();
  return useMutation({
    ...uploadSpecificationMutationOptions(),
    onSettled: (_spec, error, { code }) => refreshAfterKitchenWrite(queryClient, { error, editing: [queryKeys.ingredients.one(code)] }),
  });
}
