import type { CounterQuestionRequest, CounterQuestionView } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** Sends the kitchen a question about a product for a customer who must avoid some allergens (POST /api/counter/questions). */
export async function askCounterQuestion(request: CounterQuestionRequest): Promise<CounterQuestionView> {
  return apiClient.post<CounterQuestionView>('/counter/questions', request);
}

export function askCounterQuestionMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.askCounterQuestion(), mutationFn: askCounterQuestion });
}

/** Asks the kitchen; once sent, the questions are read again so the card and the Questions view show it waiting. */
export function useAskCounterQuestion() {
  const queryClient = useQueryClient();
  return useMutation({
    ...askCounterQuestionMutationOptions(),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.counter.questions() }),
  });
}
