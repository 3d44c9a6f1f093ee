import { userSchema, type User } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export async function getUsers({ signal }: { signal?: AbortSignal } = {}): Promise<User[]> {
  return userSchema.array().parse(await apiClient.get<unknown>('/users', { signal }));
}

export function getUsersQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.users(),
    queryFn: ({ signal }) => getUsers({ signal }),
  });
}

export function useUsers() {
  return useQuery(getUsersQueryOptions());
}
