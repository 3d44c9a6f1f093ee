import type { BookRecipe, PreviewDeclaration, Regime } from '@crumbproof/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** Declares the recipe as edited, without saving it. */
export async function previewDeclaration(
  recipe: BookRecipe,
  regime: Regime | undefined,
  { signal }: { signal?: AbortSignal } = {},
): Promise<PreviewDeclaration> {
  const query = regime ? `?regime=${regime}` : '';
  return apiClient.post<PreviewDeclaration>(`/declarations/preview${query}`, recipe, { signal });
}

/**
 * A preview is a pure function of the recipe as typed and the kitchen as recorded, so it is a
 * query keyed by that recipe: typing back to an earlier state reuses its answer, a newer
 * keystroke cancels an older request, and a write to the kitchen drops every preview.
 */
export function getPreviewQueryOptions(recipe: BookRecipe | null, regime: Regime | undefined) {
  return queryOptions({
    queryKey: queryKeys.declarations.preview(recipe, regime),
    queryFn: ({ signal }) => previewDeclaration(recipe!, regime, { signal }),
    enabled: recipe !== null,
    staleTime: 60_000,
  });
}

/** While the next keystroke's preview is worked out, the last one stays on screen, dimmed and marked busy. */
export function usePreviewDeclaration(recipe: BookRecipe | null, regime: Regime | undefined) {
  return useQuery({ ...getPreviewQueryOptions(recipe, regime), placeholderData: keepPreviousData });
}
