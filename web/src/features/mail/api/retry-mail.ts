import type { OutboxMail } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** Sends again a mail that was not sent after its last attempt. */
export async function retryMail(id: string): Promise<OutboxMail> {
  return apiClient.post<OutboxMail>(`/mail/outbox/${encodeURIComponent(id)}/retry`, {});
}

export function retryMailMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.retryMail(), mutationFn: retryMail });
}

export function useRetryMail() {
  const queryClient = useQueryClient();
  return useMutation({
    ...retryMailMutationOptions(),
    onSettled: () => queryClient.invalidateQueries({ queryKey: queryKeys.mailOutbox() }),
  });
}
