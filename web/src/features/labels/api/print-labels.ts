import { labelRunSchema, type LabelRun, type LabelRunRequest } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export async function printLabels(request: LabelRunRequest): Promise<LabelRun> {
  return labelRunSchema.parse(await apiClient.post<unknown>('/labels/runs', request));
}

export function printLabelsMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.printLabels(), mutationFn: printLabels });
}

/**
 * A print adds a run to the log and changes nothing a declaration is worked out from, so every
 * search of the print log is read again and nothing else. A refused print (4xx) logged nothing,
 * but the log is read again all the same: cheap, and never wrong.
 */
export function usePrintLabels() {
  const queryClient = useQueryClient();
  return useMutation({
    ...printLabelsMutationOptions(),
    onSettled: () => queryClient.invalidateQueries({ queryKey: queryKeys.labels.runs.all() }),
  });
}
