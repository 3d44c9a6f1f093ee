import { labelRunSchema, type LabelRun } from '@crumbproof/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { queryKeys, type LabelRunSearch } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';
import { withKitchen } from '@/lib/kitchen-choice';

const runsSchema = z.array(labelRunSchema);

/** The print log, newest first, narrowed by product, batch and production days. */
export async function getLabelRuns(search: LabelRunSearch, { signal }: { signal?: AbortSignal } = {}): Promise<LabelRun[]> {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(search)) if (typeof value === 'string' && value.trim() !== '') params.set(key, value.trim());
  const query = params.size > 0 ? `?${params.toString()}` : '';
  return runsSchema.parse(await apiClient.get<unknown>(`/labels/runs${query}`, { signal }));
}

export function getLabelRunsQueryOptions(search: LabelRunSearch) {
  return queryOptions({
    queryKey: queryKeys.labels.runs.search(search),
    queryFn: ({ signal }) => getLabelRuns(search, { signal }),
  });
}

/** While a new search is read, the rows of the last one stay on screen (marked as being read again). */
export function useLabelRuns(search: LabelRunSearch) {
  return useQuery({ ...getLabelRunsQueryOptions(search), placeholderData: keepPreviousData });
}

/** Where a run's PDF is downloaded, exactly as printed (a link the browser opens itself, so it names the kitchen). */
export const runPdfUrl = (id: number): string => withKitchen(`/api/labels/runs/${id}/pdf`);
