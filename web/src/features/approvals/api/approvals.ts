import type { ApprovalRequest, ApprovalsGiven, ApprovalsView } from '@crumbproof/shared';
import { mutationOptions, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { refreshAfterKitchenWrite } from '@/api/kitchen-writes';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** The products whose current declaration is not their approved one (GET /api/approvals; manager and pastry chef). */
export async function getApprovals({ signal }: { signal?: AbortSignal } = {}): Promise<ApprovalsView> {
  return apiClient.get<ApprovalsView>('/approvals', { signal });
}

export function getApprovalsQueryOptions() {
  return queryOptions({ queryKey: queryKeys.approvals.all(), queryFn: ({ signal }) => getApprovals({ signal }) });
}

export function useApprovals() {
  return useQuery(getApprovalsQueryOptions());
}

/** Approves products at the declarations seen, each by its inputHash (POST /api/approvals; manager). */
export async function approve(request: ApprovalRequest): Promise<ApprovalsGiven> {
  return apiClient.post<ApprovalsGiven>('/approvals', request);
}

export function approveMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.approve(), mutationFn: approve });
}

/**
 * An approval changes what the counter serves and what labels print, and what is out of date:
 * every cached declaration view is dropped and read again, as after any write to the kitchen.
 * A refusal (the declaration changed since it was seen) saved nothing, but the list is read
 * again so the manager sees what it is now.
 */
export function useApprove() {
  const queryClient = useQueryClient();
  return useMutation({
    ...approveMutationOptions(),
    onSettled: (_data, error) => {
      refreshAfterKitchenWrite(queryClient, { error });
      if (error) void queryClient.invalidateQueries({ queryKey: queryKeys.approvals.all() });
    },
  });
}
