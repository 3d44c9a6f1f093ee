import { meSchema, type Me } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient, isApiError } from '@/lib/api-client';

/** The signed-in person, or null when nobody is signed in (the API answers 401). */
export async function getMe({ signal }: { signal?: AbortSignal } = {}): Promise<Me | null> {
  try {
    return meSchema.parse(await apiClient.get<unknown>('/me', { signal }));
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
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
