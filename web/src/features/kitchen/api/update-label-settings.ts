import { labelSettingsSchema, type LabelSettings, type LabelSettingsInput } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { refreshAfterKitchenWrite } from '@/api/kitchen-writes';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export async function updateLabelSettings(settings: LabelSettingsInput): Promise<LabelSettings> {
  return labelSettingsSchema.parse(await apiClient.put<unknown>('/labels/settings', settings));
}

export function updateLabelSettingsMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.updateLabelSettings(), mutationFn: updateLabelSettings });
}

/** The batch pattern and GS1 numbers are the kitchen's data: the one refresh after a kitchen write follows. */
export function useUpdateLabelSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    ...updateLabelSettingsMutationOptions(),
    onSettled: (saved, error) =>
      refreshAfterKitchenWrite(queryClient, {
        error,
        saved: saved ? [{ queryKey: queryKeys.labels.settings(), data: saved }] : [],
        // The kitchen form sits on the same page: what is typed into it stays.
        editing: [queryKeys.labels.settings(), queryKeys.kitchen()],
      }),
  });
}
