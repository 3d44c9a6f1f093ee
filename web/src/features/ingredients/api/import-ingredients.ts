import type { ImportResult } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { refreshAfterKitchenWrite } from '@/api/kitchen-writes';
import { mutationKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** Imports every row of the spreadsheet, or none when any row has a problem. */
export async function importIngredients(file: File): Promise<ImportResult> {
  const form = new FormData();
  form.append('file', file, file.name);
  return apiClient.post<ImportResult>('/ingredients/import', form);
}

export function importIngredientsMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.importIngredients(), mutationFn: importIngredients });
}

export function useImportIngredients() {
  const queryClient = useQueryClient();
  return useMutation({
    ...importIngredientsMutationOptions(),
    onSettled: (_result, error) => refreshAfterKitchenWrite(queryClient, { error }),
  });
}
