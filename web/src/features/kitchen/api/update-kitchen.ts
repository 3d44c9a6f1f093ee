import { kitchenSchema, type KitchenUpdate, type KitchenView } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { refreshAfterKitchenWrite } from '@/api/kitchen-writes';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export async function updateKitchen(changes: KitchenUpdate): Promise<KitchenView> {
  return kitchenSchema.parse(await apiClient.patch<unknown>('/kitchen', changes));
}

export function updateKitchenMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.updateKitchen(), mutationFn: updateKitchen });
}

/** Every declaration depends on the kitchen's regime and handling, so every one is read again. */
export function useUpdateKitchen() {
  const queryClient = useQueryClient();
  return useMutation({
    ...updateKitchenMutationOptions(),
    onSettled: (saved, error) =>
      refreshAfterKitchenWrite(queryClient, {
        error,
        saved: saved ? [{ queryKey: queryKeys.kitchen(), data: saved }] : [],
        // The label settings form sits on the same page: what is typed into it stays.
        editing: [queryKeys.kitchen(), queryKeys.labels.settings()],
      }),
  });
}
