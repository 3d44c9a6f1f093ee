import type { StaleHandledRequest, StaleLabel } from '@crumbproof/shared';
import { mutationOptions, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** Printed labels and charts out of date after an approved change (GET /api/labels/stale). */
export async function getStaleLabels({ signal }: { signal?: AbortSignal } = {}): Promise<StaleLabel[]> {
  return apiClient.get<StaleLabel[]>('/labels/stale', { signal });
}

export function getStaleLabelsQueryOptions() {
  return queryOptions({ queryKey: queryKeys.labels.stale(), queryFn: ({ signal }) => getStaleLabels({ signal }) });
}

export function useStaleLabels() {
  return useQuery(getStaleLabelsQueryOptions());
}

export interface MarkHandledInput extends StaleHandledRequest {
  id: string;
}

/** A manager marks out-of-date labels handled, saying what was done (POST /api/labels/stale/:id/handled). */
export async function markStaleHandled({ id, note }: MarkHandledInput): Promise<{ id: string; handled: true }> {
  return apiClient.post<{ id: string; handled: true }>(`/labels/stale/${encodeURIComponent(id)}/handled`, { note });
}

export function markStaleHandledMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.markStaleHandled(), mutationFn: markStaleHandled });
}

/** When it settles, the list of out-of-date labels is read again. */
export function useMarkStaleHandled() {
  const queryClient = useQueryClient();
  return useMutation({
    ...markStaleHandledMutationOptions(),
    onSettled: () => queryClient.invalidateQueries({ queryKey: queryKeys.labels.stale() }),
  });
}
