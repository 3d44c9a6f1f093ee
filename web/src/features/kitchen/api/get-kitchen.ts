import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '@/lib/api-client';

/** Only what the web shows for now; the API sends more (measures, allergen handling). */
export const kitchenSchema = z.object({
  name: z.string(),
  regime: z.string(),
  address: z.string().nullable().optional(),
});
export type Kitchen = z.infer<typeof kitchenSchema>;

export async function getKitchen({ signal }: { signal?: AbortSignal } = {}): Promise<Kitchen> {
  return kitchenSchema.parse(await apiClient.get<unknown>('/kitchen', { signal }));
}

export function getKitchenQueryOptions() {
  return queryOptions({
    queryKey: ['kitchen'],
    queryFn: ({ signal }) => getKitchen({ signal }),
    staleTime: 10 * 60_000,
  });
}

export function useKitchen() {
  return useQuery(getKitchenQueryOptions());
}
