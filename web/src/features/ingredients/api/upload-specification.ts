import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { specificationsQueryKey } from './get-specifications';
import { specificationStatusQueryKey } from './get-specification-status';
import type { Specification } from './types';

export const SPECIFICATION_MAX_BYTES = 10 * 1024 * 1024;

export interface UploadSpecificationInput {
  code: string;
  file: File;
  /** YYYY-MM-DD, today or later. */
  reviewBy: string;
  note?: string;
}

export async function uploadSpecification({ code, file, reviewBy, note }: UploadSpecificationInput): Promise<Specification> {
  const form = new FormData();
  form.append('reviewBy', reviewBy);
  if (note && note.trim() !== '') form.append('note', note.trim());
  // The file goes last so the API has read the fields before the bytes arrive.
  form.append('file', file, file.name);
  return apiClient.post<Specification>(`/ingredients/${encodeURIComponent(code)}/specifications`, form);
}

export function uploadSpecificationMutationOptions() {
  return mutationOptions({ mutationKey: ['specifications', 'upload'], mutationFn: uploadSpecification });
}

export function useUploadSpecification() {
  const queryClient = useQueryClient();
  return useMutation({
    ...uploadSpecificationMutationOptions(),
    onSuccess: (_spec, { code }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: specificationsQueryKey(code) }),
        queryClient.invalidateQueries({ queryKey: specificationStatusQueryKey }),
      ]),
  });
}
