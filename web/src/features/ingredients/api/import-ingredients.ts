import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { specificationStatusQueryKey } from './get-specification-status';
import { ingredientsQueryKey, type ImportResult } from './types';

/** Imports every row of the spreadsheet, or none when any row has a problem. */
export async function importIngredients(file: File): Promise<ImportResult> {
  const form = new FormData();
  form.append('file', file, file.name);
  return apiClient.post<ImportResult>('/ingredients/import', form);
}

export function importIngredientsMutationOptions() {
  return mutationOptions({ mutationKey: ['ingredients', 'import'], mutationFn: importIngredients });
}

export function useImportIngredients() {
  const queryClient = useQueryClient();
  return useMutation({
    ...importIngredientsMutationOptions(),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: ingredientsQueryKey }),
        queryClient.invalidateQueries({ queryKey: specificationStatusQueryKey }),
      ]),
  });
}
