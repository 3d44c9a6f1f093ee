import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { describe, expect, it } from 'vitest';
import { mockApi } from '@/testing/mock-api';
import { RECIPES } from '../testing/fixtures';
import { declarationsQueryKey } from './get-declarations';
import { declarationQueryKey } from './get-declaration';
import { recipeQueryKey } from './get-recipe';
import { recipesQueryKey } from '@/api/recipes';
import { revisionsQueryKey } from './get-revisions';
import { useSaveRecipe } from './save-recipe';

describe('useSaveRecipe', () => {
  it('PUTs the recipe and invalidates the recipe, its declarations, the list, the history and product declarations', async () => {
    const { calls } = mockApi({
      'PUT /api/recipes/victoria-sponge': ({ body }) => ({
        body: { ...(body as object), revision: 5, updatedAt: '2026-12-01T19:00:00.000Z' },
      }),
    });
    const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity } } });
    const keys = [
      recipeQueryKey('victoria-sponge'),
      declarationQueryKey('victoria-sponge', 'UK'),
      declarationQueryKey('victoria-sponge', 'US'),
      recipesQueryKey,
      revisionsQueryKey('victoria-sponge'),
      declarationsQueryKey(undefined),
      // A product that uses this recipe as a sub-recipe.
      declarationQueryKey('trifle', 'UK'),
    ];
    for (const key of keys) queryClient.setQueryData(key, { cached: true });
    const untouched = ['kitchen'];
    queryClient.setQueryData(untouched, { cached: true });

    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
    const { result } = renderHook(() => useSaveRecipe(), { wrapper });
    const { id, name, lines } = RECIPES[0]!;
    act(() => result.current.mutate({ recipe: { id, name, lines }, code: 'victoria-sponge' }));
    await waitFor(() => expect(result.current.isSuccess).toBe(true));

    expect(calls).toEqual([expect.objectContaining({ method: 'PUT', path: '/api/recipes/victoria-sponge', body: { id, name, lines } })]);
    for (const key of keys.slice(1)) expect(queryClient.getQueryState(key)?.isInvalidated, JSON.stringify(key)).toBe(true);
    expect(queryClient.getQueryData(recipeQueryKey('victoria-sponge'))).toMatchObject({ revision: 5 });
    expect(queryClient.getQueryState(untouched)?.isInvalidated).toBe(false);
  });

  it('POSTs a new recipe', async () => {
    const { calls } = mockApi({
      'POST /api/recipes': ({ body }) => ({
        status: 201,
        body: { ...(body as object), revision: 1, updatedAt: '2026-12-01T19:00:00.000Z' },
      }),
    });
    const queryClient = new QueryClient();
    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
    const { result } = renderHook(() => useSaveRecipe(), { wrapper });
    act(() => result.current.mutate({ recipe: { id: 'curd', name: 'Curd', lines: [{ use: 'butter', qty: 1, unit: 'g' }] } }));
    await waitFor(() => expect(result.current.isSuccess).toBe(true));
    expect(calls.map((call) => `${call.method} ${call.path}`)).toEqual(['POST /api/recipes']);
  });
});
