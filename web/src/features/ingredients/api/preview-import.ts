import type { ImportPreview } from '@crumbproof/shared';
import { mutationOptions, useMutation } from '@tanstack/react-query';
import { mutationKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** Reads a spreadsheet and says what importing it would do. Nothing is saved. */
export async function previewImport(file: File): Promise<ImportPreview> {
  const form = new FormData();
  form.append('file', file, file.name);
  return apiClient.post<ImportPreview>('/ingredients/import/preview', form);
}

export function previewImportMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.previewImport(), mutationFn: previewImport });
}

export function usePreviewImport() {
  return useMutation(previewImportMutationOptions());
}
