import type { OutboxPage } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export async function getOutbox({ signal }: { signal?: AbortSignal } = {}): Promise<OutboxPage> {
  return apiClient.get<OutboxPage>('/mail/outbox', { signal });
}

export function getOutboxQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.mailOutbox(),
    queryFn: ({ signal }) => getOutbox({ signal }),
    // Mail is sent in the background: the page reads the outbox again while it is open.
    refetchInterval: 15_000,
  });
}

export function useOutbox() {
  return useQuery(getOutboxQueryOptions());
}
