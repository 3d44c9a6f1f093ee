import type { CounterDay, CounterDayView } from '@crumbproof/shared';
import { mutationOptions, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** The products marked on sale on a day, and who marked them (GET /api/counter/today?date=). */
export async function getCounterDay(date: string, { signal }: { signal?: AbortSignal } = {}): Promise<CounterDayView> {
  return apiClient.get<CounterDayView>(`/counter/today?date=${encodeURIComponent(date)}`, { signal });
}

export function getCounterDayQueryOptions(date: string) {
  return queryOptions({ queryKey: queryKeys.counter.day(date), queryFn: ({ signal }) => getCounterDay(date, { signal }) });
}

/** One day's products on sale; `enabled` is false while no day is picked. */
export function useCounterDay(date: string, enabled = true) {
  return useQuery({ ...getCounterDayQueryOptions(date), enabled });
}

/** Marks the products on sale on a day (manager, pastry chef); the counter's list then follows it. */
export async function setCounterDay(day: CounterDay): Promise<CounterDayView> {
  return apiClient.put<CounterDayView>('/counter/today', day);
}

export function setCounterDayMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.setCounterDay(), mutationFn: setCounterDay });
}

export function useSetCounterDay() {
  const queryClient = useQueryClient();
  return useMutation({
    ...setCounterDayMutationOptions(),
    onSuccess: async (saved) => {
      queryClient.setQueryData(queryKeys.counter.day(saved.date), saved);
      // Each product's "on sale today" comes with the counter's products.
      await queryClient.invalidateQueries({ queryKey: queryKeys.counter.products() });
    },
  });
}
