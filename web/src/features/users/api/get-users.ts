import { userSchema, type User } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';

export async function getUsers({ signal }: { signal?: AbortSignal } = {}): Promise<User[]> {
  return userSchema.array().parse(await apiClient.get<unknown>('/users', { signal }));
}

export const usersQueryKey = ['users'] as const;

export function getUsersQueryOptions() {
  return queryOptions({
    queryKey: usersQueryKey,
    queryFn: ({ signal }) => getUsers({ signal }),
  });
}

export function useUsers() {
  return useQuery(getUsersQueryOptions());
}
