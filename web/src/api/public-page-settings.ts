import type { PublicPageSettingsView } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from './query-keys';
import { apiClient } from '@/lib/api-client';

/** Whether the kitchen's public product page is on, and the address customers reach it at (manager, pastry chef): the Kitchen page changes it, the Labels preview draws its QR codes. */
export async function getPublicPageSettings({ signal }: { signal?: AbortSignal } = {}): Promise<PublicPageSettingsView> {
  return apiClient.get<PublicPageSettingsView>('/public-page/settings', { signal });
}

export function getPublicPageSettingsQueryOptions() {
  return queryOptions({ queryKey: queryKeys.publicPage.settings(), queryFn: ({ signal }) => getPublicPageSettings({ signal }) });
}

export function usePublicPageSettings() {
  return useQuery(getPublicPageSettingsQueryOptions());
}
