import { labelSettingsSchema, type LabelSettings } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { queryKeys } from './query-keys';

/**
 * The kitchen's label settings: the batch code pattern, the GS1 company prefix, the SSCC
 * extension digit and the case indicator digit. The kitchen page changes them; the Labels page
 * and the recipe editor read them.
 */
export async function getLabelSettings({ signal }: { signal?: AbortSignal } = {}): Promise<LabelSettings> {
  return labelSettingsSchema.parse(await apiClient.get<unknown>('/labels/settings', { signal }));
}

export function getLabelSettingsQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.labels.settings(),
    queryFn: ({ signal }) => getLabelSettings({ signal }),
    staleTime: 10 * 60_000,
  });
}

export function useLabelSettings({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getLabelSettingsQueryOptions(), enabled });
}
