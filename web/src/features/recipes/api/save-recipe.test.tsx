import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { describe, expect, it } from 'vitest';
import { mockApi } from '@/testing/mock-api';
import { RECIPES } from '../testing/fixtures';
import { queryKeys } from '@/api/query-keys';
import { useSaveRecipe } from './save-recipe';

describe('useSaveRecipe', () => {
  it('PUTs the recipe, keeps the saved revision and drops every declaration, list and history it can change', async () => {
    const { calls } = mockApi({
      'PUT /api/recipes/victoria-sponge': ({ body }) => ({
        body: { ...(body as object), revision: 5, updatedAt: '2026-12-01T19:00:00.000Z' },
      }),
    });
    const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity } } });
    const dropped = [
      queryKeys.declarations.product('victoria-sponge', 'UK'),
      queryKeys.declarations.product('victoria-sponge', 'US'),
      queryKeys.recipes.list(),
      queryKeys.recipes.revisions('victoria-sponge'),
      queryKeys.declarations.products(undefined),
      // A product that uses this recipe as a sub-recipe.
      queryKeys.declarations.product('trifle', 'UK'),
      // Where an ingredient is used: the recipe may have gained or lost it.
      queryKeys.ingredients.usedIn('butter'),
    ];
    for (const key of dropped) queryClient.setQueryData(key, { cached: true });
    queryClient.setQueryData(queryKeys.recipes.one('victoria-sponge'), { ...RECIPES[0], revision: 4 });
    const untouched = queryKeys.me();
    queryClient.setQueryData(untouched, { cached: true });

    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
    const { result } = renderHook(() => useSaveRecipe(), { wrapper });
    const { id, name, lines } = RECIPES[0]!;
    act(() => result.current.mutate({ recipe: { id, name, lines }, code: 'victoria-sponge', baseRevision: 4 }));
    await waitFor(() => expect(result.current.isSuccess).toBe(true));

    expect(calls).toEqual([
      expect.objectContaining({ method: 'PUT', path: '/api/recipes/victoria-sponge', body: { id, name, lines, baseRevision: 4 } }),
    ]);
    for (const key of dropped) expect(queryClient.getQueryData(key), JSON.stringify(key)).toBeUndefined();
    expect(queryClient.getQueryData(queryKeys.recipes.one('victoria-sponge'))).toMatchObject({ revision: 5 });
    expect(queryClient.getQueryData(untouched)).toEqual({ cached: true });
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
