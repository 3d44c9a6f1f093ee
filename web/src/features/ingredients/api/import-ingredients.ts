import type { ImportResult } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { refreshAfterKitchenWrite } from '@/api/kitchen-writes';
import { mutationKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export interface ImportIngredientsInput {
  file: File;
  /** The preview's basis: the API imports nothing when a row's ingredient changed since (stale-preview). */
  basis: string;
}

/** Imports every row of the spreadsheet, or none when any row has a problem or changed since the preview. */
export async function importIngredients({ file, basis }: ImportIngredientsInput): Promise<ImportResult> {
  const form = new FormData();
  form.append('basis', basis);
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
