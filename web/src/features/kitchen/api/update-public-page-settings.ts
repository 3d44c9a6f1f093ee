import type { PublicPageSettings, PublicPageSettingsView } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export async function updatePublicPageSettings(settings: PublicPageSettings): Promise<PublicPageSettingsView> {
  return apiClient.put<PublicPageSettingsView>('/public-page/settings', settings);
}

export function updatePublicPageSettingsMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.updatePublicPageSettings(), mutationFn: updatePublicPageSettings });
}

/** Saves the settings; no declaration depends on them, so only their own answer is replaced. */
export function useUpdatePublicPageSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    ...updatePublicPageSettingsMutationOptions(),
    onSuccess: (saved) => queryClient.setQueryData(queryKeys.publicPage.settings(), saved),
  });
}
