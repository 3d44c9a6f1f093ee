import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { describe, expect, it } from 'vitest';
import { queryKeys } from '@/api/query-keys';
import { mockApi } from '@/testing/mock-api';
import { usePrintLabels } from './print-labels';

const RUN = {
  id: 9,
  printedAt: '2026-12-02T06:10:00.000Z',
  printedBy: { id: 1, name: 'Maren Okafor' },
  template: 'product',
  productionDate: '2026-12-02',
  items: [],
  override: null,
  pdfBytes: 1000,
  sha256: '0'.repeat(64),
  current: true,
};

describe('printing a run', () => {
  it.each([
    ['printed', { status: 201, body: RUN }],
    ['refused', { status: 422, body: { statusCode: 422, code: 'label-refused', message: 'The labels cannot be printed.' } }],
  ])('marks every search of the print log to be read again when %s, and leaves the declarations cached', async (_, answer) => {
    mockApi({ 'POST /api/labels/runs': answer });
    const queryClient = new QueryClient({
      defaultOptions: { queries: { staleTime: Infinity, retry: false }, mutations: { retry: false } },
    });
    const log = [queryKeys.labels.runs.search({}), queryKeys.labels.runs.search({ batch: '261202-LEMONT-1' })];
    for (const key of log) queryClient.setQueryData(key, []);
    queryClient.setQueryData(queryKeys.declarations.product('lemon-tart', undefined), { cached: true });
    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;

    const { result } = renderHook(() => usePrintLabels(), { wrapper });
    act(() =>
      result.current.mutate({ template: 'product', productionDate: '2026-12-02', items: [{ product: 'lemon-tart', quantity: 1 }] }),
    );
    await waitFor(() => expect(result.current.isIdle).toBe(false));
    await waitFor(() => expect(result.current.isPending).toBe(false));

    for (const key of log) await waitFor(() => expect(queryClient.getQueryState(key)?.isInvalidated, JSON.stringify(key)).toBe(true));
    expect(queryClient.getQueryData(queryKeys.declarations.product('lemon-tart', undefined))).toEqual({ cached: true });
  });
});
