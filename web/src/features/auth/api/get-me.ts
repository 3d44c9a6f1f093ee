import { meSchema, type Me } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient, isApiError } from '@/lib/api-client';
import { currentKitchen, forgetKitchen } from '@/lib/kitchen-choice';

/**
 * The signed-in person with their role at the chosen kitchen, or null when nobody is signed in
 * (the API answers 401). Refused at the chosen kitchen (their role there was taken away), the
 * app stops naming it and asks again, so they are offered the kitchens they still work in.
 */
export async function getMe({ signal }: { signal?: AbortSignal } = {}): Promise<Me | null> {
  try {
    return meSchema.parse(await apiClient.get<unknown>('/me', { signal }));
  } catch (error) {
    if (isApiError(error) && error.status === 401) {
      forgetKitchen({ quietly: true });
      return null;
    }
    if (isApiError(error) && error.status === 403 && currentKitchen() !== null) {
      forgetKitchen({ quietly: true });
      return getMe({ signal });
    }
    throw error;
  }
}

export function getMeQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.me(),
    queryFn: ({ signal }) => getMe({ signal }),
    staleTime: 5 * 60_000,
  });
}

export function useMe() {
  return useQuery(getMeQueryOptions());
}
