import { takenOffKitchenSchema, type TakenOffKitchen } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { mutationKeys, queryKeys } from '@/api/query-keys';

/** Takes someone off the kitchen the app works in: their role here goes; their account and other kitchens stay. */
export async function takeOffKitchen(id: number): Promise<TakenOffKitchen> {
  return takenOffKitchenSchema.parse(await apiClient.delete<unknown>(`/users/${id}/kitchen`));
}

export function takeOffKitchenMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.takeOffKitchen(), mutationFn: takeOffKitchen });
}

export function useTakeOffKitchen() {
  const queryClient = useQueryClient();
  return useMutation({
    ...takeOffKitchenMutationOptions(),
    // A refusal reads the list again too: the person may have been taken off, or a manager added, meanwhile.
    onSettled: () => queryClient.invalidateQueries({ queryKey: queryKeys.users() }),
  });
}
