import type { ReviewsDue } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** The supplier specifications overdue for review and due within 30 days, counted from the kitchen's today. */
export async function getReviewsDue({ signal }: { signal?: AbortSignal } = {}): Promise<ReviewsDue> {
  return apiClient.get<ReviewsDue>('/specifications/reviews-due', { signal });
}

export function getReviewsDueQueryOptions() {
  return queryOptions({ queryKey: queryKeys.specifications.reviewsDue(), queryFn: ({ signal }) => getReviewsDue({ signal }) });
}

export function useReviewsDue() {
  return useQuery(getReviewsDueQueryOptions());
}
