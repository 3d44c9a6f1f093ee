import { afterEach, describe, expect, it, vi } from 'vitest';
import { requestUrl } from '@/testing/mock-api';
import { getIngredients, INGREDIENT_PAGE_SIZE } from './ingredients';

describe('getIngredients', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('reads a large library page by page until a short page', async () => {
    const total = INGREDIENT_PAGE_SIZE * 2 + 7;
    const asked: string[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn((input: RequestInfo | URL) => {
        const url = new URL(requestUrl(input), 'http://crumbproof.test');
        asked.push(url.search);
        const offset = Number(url.searchParams.get('offset'));
        const limit = Number(url.searchParams.get('limit'));
        const rows = Array.from({ length: Math.max(0, Math.min(limit, total - offset)) }, (_, i) => ({
          id: `i${offset + i}`,
          name: `I ${offset + i}`,
        }));
        return Promise.resolve(new Response(JSON.stringify(rows), { status: 200, headers: { 'content-type': 'application/json' } }));
      }),
    );
    const rows = await getIngredients();
    expect(rows).toHaveLength(total);
    expect(rows[total - 1]?.id).toBe(`i${total - 1}`);
    expect(asked).toEqual([0, 1, 2].map((p) => `?limit=${INGREDIENT_PAGE_SIZE}&offset=${p * INGREDIENT_PAGE_SIZE}`));
  });
});
