import type { IngredientView, ServedDeclaration } from '@crumbproof/shared';
import { QueryClient, QueryClientProvider, QueryObserver } from '@tanstack/react-query';
import { act, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { describe, expect, it, vi } from 'vitest';
import { useCreateIngredient } from '@/features/ingredients/api/create-ingredient';
import { useImportIngredients } from '@/features/ingredients/api/import-ingredients';
import { useUpdateIngredient } from '@/features/ingredients/api/update-ingredient';
import { useUploadSpecification } from '@/features/ingredients/api/upload-specification';
import { useUpdateKitchen } from '@/features/kitchen/api/update-kitchen';
import { useUpdateLabelSettings } from '@/features/kitchen/api/update-label-settings';
import { getDeclarationQueryOptions } from './declaration';
import { useSaveRecipe } from '@/features/recipes/api/save-recipe';
import { useApplySwap } from '@/features/swaps/api/apply-swap';
import { KITCHEN, LABEL_SETTINGS, mockApi, requestUrl, type MockResponse } from '@/testing/mock-api';
import { queryKeys } from './query-keys';

const SPELT: IngredientView = {
  id: 'spelt-flour',
  name: 'Wholegrain spelt flour',
  contains: ['spelt'],
  mayContain: [],
  vegan: true,
  vegetarian: true,
  revision: 2,
  updatedAt: '2026-11-20T10:00:00.000Z',
};

/** A served declaration reduced to what these tests read: what it contains. */
function declaring(...allergens: string[]): ServedDeclaration {
  return { product: 'loaf', contains: allergens.map((allergen) => ({ allergen })) } as unknown as ServedDeclaration;
}

function json(body: unknown, status = 200): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

/**
 * The API for one ingredient save; declaration reads wait until the test answers them, in the
 * order they were asked, so a test decides what is in flight when the write finishes.
 */
function setUp(saveAnswer: MockResponse) {
  const pending: ((body: unknown) => void)[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const url = requestUrl(input);
      if (url.startsWith('/api/recipes/loaf/declaration')) {
        return new Promise<Response>((resolve, reject) => {
          init?.signal?.addEventListener('abort', () => reject(new DOMException('The read was cancelled.', 'AbortError')));
          pending.push((body) => resolve(json(body)));
        });
      }
      if (url === '/api/ingredients/spelt-flour' && init?.method === 'PUT') return json(saveAnswer.body, saveAnswer.status);
      return json({ statusCode: 404, code: 'not-found', message: `No mock for ${url}.` }, 404);
    }),
  );
  const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity, retry: false }, mutations: { retry: false } } });
  const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
  return { queryClient, wrapper, pending };
}

const saved: MockResponse = { body: { ...SPELT, contains: ['spelt', 'milk'], revision: 3 } };

describe('refreshAfterKitchenWrite, as every kitchen write calls it', () => {
  it('drops every cached declaration, product list, preview, list and used-in view, and keeps what the write returned', async () => {
    const { queryClient, wrapper } = setUp(saved);
    const dependent = [
      queryKeys.declarations.product('loaf', undefined),
      queryKeys.declarations.product('loaf', 'US'),
      queryKeys.declarations.products(undefined),
      queryKeys.declarations.preview({ id: 'tart', name: 'Tart', lines: [{ use: 'spelt-flour', qty: 1, unit: 'g' }] }, undefined),
      queryKeys.ingredients.list(),
      queryKeys.ingredients.list({ q: 'spelt' }),
      queryKeys.ingredients.usedIn('spelt-flour'),
      queryKeys.ingredients.revisions('spelt-flour'),
      queryKeys.recipes.list(),
      queryKeys.recipes.one('loaf'),
      queryKeys.specifications.status(),
      // Whether a logged run's revision is still current.
      queryKeys.labels.runs.search({}),
    ];
    for (const key of dependent) queryClient.setQueryData(key, { cached: true });
    queryClient.setQueryData(queryKeys.ingredients.one('spelt-flour'), SPELT);
    const independent = [queryKeys.me(), queryKeys.users(), queryKeys.reference.nutrients()];
    for (const key of independent) queryClient.setQueryData(key, { cached: true });

    const { result } = renderHook(() => useUpdateIngredient(), { wrapper });
    act(() =>
      result.current.mutate({ code: 'spelt-flour', ingredient: { ...SPELT, contains: ['spelt', 'milk'] }, baseRevision: SPELT.revision }),
    );
    await waitFor(() => expect(result.current.isSuccess).toBe(true));

    for (const key of dependent) expect(queryClient.getQueryData(key), JSON.stringify(key)).toBeUndefined();
    expect(queryClient.getQueryData(queryKeys.ingredients.one('spelt-flour'))).toMatchObject({ revision: 3, contains: ['spelt', 'milk'] });
    for (const key of independent) expect(queryClient.getQueryData(key), JSON.stringify(key)).toEqual({ cached: true });
  });

  it('never lets a declaration read before the write finished land after it: the page gets the one read afterwards', async () => {
    const { queryClient, wrapper, pending } = setUp(saved);
    const key = queryKeys.declarations.product('loaf', undefined);
    // The product page is open, and its declaration is being read when the write finishes.
    const observer = new QueryObserver(queryClient, getDeclarationQueryOptions('loaf', undefined));
    const shown: ServedDeclaration[] = [];
    const unsubscribe = observer.subscribe((state) => {
      if (state.data) shown.push(state.data);
    });
    await waitFor(() => expect(pending).toHaveLength(1));

    const { result } = renderHook(() => useUpdateIngredient(), { wrapper });
    act(() =>
      result.current.mutate({ code: 'spelt-flour', ingredient: { ...SPELT, contains: ['spelt', 'milk'] }, baseRevision: SPELT.revision }),
    );
    await waitFor(() => expect(result.current.isSuccess).toBe(true));
    // The write dropped the read in flight and asked again.
    await waitFor(() => expect(pending).toHaveLength(2));

    // The first read's answer, worked out before the write, comes back late: it is not kept.
    act(() => pending[0]!(declaring('gluten')));
    await new Promise((resolve) => setTimeout(resolve, 20));
    expect(queryClient.getQueryData(key)).toBeUndefined();

    act(() => pending[1]!(declaring('gluten', 'milk')));
    await waitFor(() => expect(queryClient.getQueryData(key)).toEqual(declaring('gluten', 'milk')));
    expect(shown).toEqual([declaring('gluten', 'milk')]);
    unsubscribe();
  });

  it('changes nothing in the cache when the API refuses the write', async () => {
    const { queryClient, wrapper } = setUp({
      status: 400,
      body: { statusCode: 400, code: 'validation', message: 'Give the ingredient a name.' },
    });
    queryClient.setQueryData(queryKeys.declarations.product('loaf', undefined), declaring('gluten'));
    queryClient.setQueryData(queryKeys.ingredients.one('spelt-flour'), SPELT);

    const { result } = renderHook(() => useUpdateIngredient(), { wrapper });
    act(() => result.current.mutate({ code: 'spelt-flour', ingredient: { ...SPELT, name: '' }, baseRevision: SPELT.revision }));
    await waitFor(() => expect(result.current.isError).toBe(true));

    expect(queryClient.getQueryData(queryKeys.declarations.product('loaf', undefined))).toEqual(declaring('gluten'));
    expect(queryClient.getQueryState(queryKeys.declarations.product('loaf', undefined))?.isInvalidated).toBe(false);
  });

  it('after a write whose answer was lost, drops the declarations but keeps the ingredient being edited on screen', async () => {
    const { queryClient, wrapper } = setUp({ status: 502, body: { statusCode: 502, code: 'internal', message: 'The server failed.' } });
    queryClient.setQueryData(queryKeys.declarations.product('loaf', undefined), declaring('gluten'));
    queryClient.setQueryData(queryKeys.ingredients.one('spelt-flour'), SPELT);

    const { result } = renderHook(() => useUpdateIngredient(), { wrapper });
    act(() =>
      result.current.mutate({ code: 'spelt-flour', ingredient: { ...SPELT, contains: ['spelt', 'milk'] }, baseRevision: SPELT.revision }),
    );
    await waitFor(() => expect(result.current.isError).toBe(true));

    expect(queryClient.getQueryData(queryKeys.declarations.product('loaf', undefined))).toBeUndefined();
    // The form is built from it: kept, and marked to be read again.
    expect(queryClient.getQueryData(queryKeys.ingredients.one('spelt-flour'))).toEqual(SPELT);
    expect(queryClient.getQueryState(queryKeys.ingredients.one('spelt-flour'))?.isInvalidated).toBe(true);
  });
});

describe('every write to the kitchen’s data refreshes the declarations and where items are used', () => {
  /** What a test needs of each write's hook, whatever its input and answer. */
  type Write = { mutate: (input: never) => void; isSuccess: boolean };
  const file = new File(['id,name\n'], 'sheet.csv', { type: 'text/csv' });
  const writes = [
    {
      title: 'an ingredient added',
      route: 'POST /api/ingredients',
      answer: SPELT,
      useWrite: (): Write => useCreateIngredient(),
      input: SPELT,
    },
    {
      title: 'an ingredient saved',
      route: 'PUT /api/ingredients/spelt-flour',
      answer: SPELT,
      useWrite: (): Write => useUpdateIngredient(),
      input: { code: 'spelt-flour', ingredient: SPELT, baseRevision: SPELT.revision },
    },
    {
      title: 'a spreadsheet imported',
      route: 'POST /api/ingredients/import',
      answer: { create: 0, update: 1, unchanged: 0, withProblems: 0, written: [] },
      useWrite: (): Write => useImportIngredients(),
      input: { file, basis: '{}' },
    },
    {
      title: 'a specification uploaded',
      route: 'POST /api/ingredients/spelt-flour/specifications',
      answer: { id: 1 },
      useWrite: (): Write => useUploadSpecification(),
      input: { code: 'spelt-flour', file, reviewBy: '2099-01-01' },
    },
    {
      title: 'a recipe saved',
      route: 'PUT /api/recipes/loaf',
      answer: { id: 'loaf', name: 'Loaf', lines: [], revision: 2, updatedAt: '2026-12-01T10:00:00.000Z' },
      useWrite: (): Write => useSaveRecipe(),
      input: {
        code: 'loaf',
        baseRevision: 1,
        recipe: { id: 'loaf', name: 'Loaf', lines: [{ use: 'spelt-flour', qty: 500, unit: 'g' as const }] },
      },
    },
    {
      title: 'a swap applied',
      route: 'POST /api/swaps/apply',
      answer: { recipes: [{ id: 'loaf', revision: 3 }] },
      useWrite: (): Write => useApplySwap(),
      input: { from: 'spelt-flour', to: 'plain-flour' },
    },
    {
      title: 'the kitchen’s settings changed',
      route: 'PATCH /api/kitchen',
      answer: { ...KITCHEN, regime: 'EU' },
      useWrite: (): Write => useUpdateKitchen(),
      input: { regime: 'EU' as const },
    },
    {
      title: 'the kitchen’s label settings changed',
      route: 'PUT /api/labels/settings',
      answer: { ...LABEL_SETTINGS, caseIndicator: 2 },
      useWrite: (): Write => useUpdateLabelSettings(),
      input: { ...LABEL_SETTINGS, caseIndicator: 2 },
    },
  ];

  it.each(writes)('$title', async ({ route, answer, useWrite, input }) => {
    mockApi({ [route]: { body: answer } });
    const queryClient = new QueryClient({
      defaultOptions: { queries: { staleTime: Infinity, retry: false }, mutations: { retry: false } },
    });
    const dependent = [
      queryKeys.declarations.product('loaf', undefined),
      queryKeys.declarations.products(undefined),
      queryKeys.ingredients.usedIn('spelt-flour'),
      queryKeys.specifications.status(),
      // Whether a logged run's revision is still current.
      queryKeys.labels.runs.search({}),
    ];
    for (const key of dependent) queryClient.setQueryData(key, { cached: true });
    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;

    const { result } = renderHook(useWrite, { wrapper });
    // Each hook takes its own input; the table pairs them.
    act(() => (result.current.mutate as (value: unknown) => void)(input));
    await waitFor(() => expect(result.current.isSuccess).toBe(true));

    for (const key of dependent) expect(queryClient.getQueryData(key), JSON.stringify(key)).toBeUndefined();
  });
});
