import type { CounterAnswerRequest, CounterQuestionView } from '@crumbproof/shared';
import { mutationOptions, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/**
 * No event tells an open counter that a question was asked (only that one was answered), so the
 * list is read again this often while a view that shows it is open.
 */
export const QUESTIONS_REFRESH_MS = 20_000;

/** Every question asked of the kitchen, newest first, answered or not (GET /api/counter/questions). */
export async function getCounterQuestions({ signal }: { signal?: AbortSignal } = {}): Promise<CounterQuestionView[]> {
  return apiClient.get<CounterQuestionView[]>('/counter/questions', { signal });
}

export function getCounterQuestionsQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.counter.questions(),
    queryFn: ({ signal }) => getCounterQuestions({ signal }),
    refetchInterval: QUESTIONS_REFRESH_MS,
  });
}

/** Every question, newest first: the Questions view and a product card's earlier questions read it. */
export function useCounterQuestions() {
  return useQuery(getCounterQuestionsQueryOptions());
}

/** How many questions wait for the kitchen's answer, for the Questions tab's label; undefined until read. */
export function useOpenQuestionCount(): number | undefined {
  return useQuery({ ...getCounterQuestionsQueryOptions(), select: (questions) => questions.filter((q) => q.answer === null).length }).data;
}

export interface AnswerQuestionInput extends CounterAnswerRequest {
  id: number;
}

/** The kitchen answers a question (manager, pastry chef); every open counter is told by the events stream. */
export async function answerCounterQuestion({ id, answer }: AnswerQuestionInput): Promise<CounterQuestionView> {
  return apiClient.post<CounterQuestionView>(`/counter/questions/${id}/answer`, { answer });
}

export function answerCounterQuestionMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.answerCounterQuestion(), mutationFn: answerCounterQuestion });
}

/** Answers a question; when it settles (answered, or refused because someone answered first) the list is read again. */
export function useAnswerCounterQuestion() {
  const queryClient = useQueryClient();
  return useMutation({
    ...answerCounterQuestionMutationOptions(),
    onSettled: () => queryClient.invalidateQueries({ queryKey: queryKeys.counter.questions() }),
  });
}
