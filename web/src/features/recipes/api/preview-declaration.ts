import type { BookRecipe, Regime } from '@crumbproof/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { DeclarationView } from './types';

/** Declares the recipe as edited, without saving it. */
export async function previewDeclaration(
  recipe: BookRecipe,
  regime: Regime | undefined,
  { signal }: { signal?: AbortSignal } = {},
): Promise<DeclarationView> {
  const query = regime ? `?regime=${regime}` : '';
  return apiClient.post<DeclarationView>(`/declarations/preview${query}`, recipe, { signal });
}

export const previewQueryPrefix = ['declarations', 'preview'] as const;

/**
 * A preview is a pure function of the recipe as typed, so it is a query keyed by that recipe:
 * typing back to an earlier state reuses its answer, and a newer keystroke cancels an older request.
 */
export function getPreviewQueryOptions(recipe: BookRecipe | null, regime: Regime | undefined) {
  return queryOptions({
    queryKey: [...previewQueryPrefix, regime ?? 'kitchen', recipe] as const,
    queryFn: ({ signal }) => previewDeclaration(recipe!, regime, { signal }),
    enabled: recipe !== null,
    staleTime: 60_000,
  });
}

export function usePreviewDeclaration(recipe: BookRecipe | null, regime: Regime | undefined) {
  return useQuery({ ...getPreviewQueryOptions(recipe, regime), placeholderData: keepPreviousData });
}
