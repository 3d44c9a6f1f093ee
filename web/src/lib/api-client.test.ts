import { KITCHEN_HEADER } from '@crumbproof/shared';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError, apiClient } from './api-client';
import { forgetKitchen, storedKitchen, withKitchen, workIn } from './kitchen-choice';

function answer(status: number, body?: unknown) {
  const fetchMock = vi.fn(() => Promise.resolve(new Response(body === undefined ? null : JSON.stringify(body), { status })));
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

describe('apiClient', () => {
  it('sends JSON with the session cookie to /api and returns the parsed body', async () => {
    const fetchMock = answer(200, { id: 1 });
    await expect(apiClient.post('/users', { name: 'Ines' })).resolves.toEqual({ id: 1 });
    expect(fetchMock).toHaveBeenCalledWith(
      '/api/users',
      expect.objectContaining({
        method: 'POST',
        credentials: 'include',
        body: JSON.stringify({ name: 'Ines' }),
        headers: expect.objectContaining({ 'Content-Type': 'application/json' }),
      }),
    );
  });

  it('sends FormData as multipart, leaving the Content-Type (and its boundary) to the browser', async () => {
    const fetchMock = answer(201, { id: 7 });
    const form = new FormData();
    form.append('reviewBy', '2027-01-31');
    await expect(apiClient.post('/ingredients/flour/specifications', form)).resolves.toEqual({ id: 7 });
    const init = (fetchMock.mock.calls[0] as unknown as [string, RequestInit])[1];
    expect(init.body).toBe(form);
    expect(init.headers).not.toHaveProperty('Content-Type');
  });

  it('sends PUT with a JSON body', async () => {
    const fetchMock = answer(200, { id: 'flour' });
    await apiClient.put('/ingredients/flour', { id: 'flour' });
    expect(fetchMock).toHaveBeenCalledWith('/api/ingredients/flour', expect.objectContaining({ method: 'PUT', body: '{"id":"flour"}' }));
  });

  it('returns nothing for 204', async () => {
    answer(204);
    await expect(apiClient.post('/auth/sign-out')).resolves.toBeUndefined();
  });

  it('throws an ApiError carrying the API’s status, code, message and fields', async () => {
    answer(400, {
      statusCode: 400,
      code: 'validation',
      message: 'password: Use at least 12 characters.',
      fields: [{ path: 'password', message: 'Use at least 12 characters.' }],
    });
    const error = await apiClient.post('/users', {}).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 400,
      code: 'validation',
      message: 'password: Use at least 12 characters.',
      fields: [{ path: 'password', message: 'Use at least 12 characters.' }],
    });
  });

  it('carries the problems of a refused recipe book, with their ids, as the API sent them', async () => {
    const problems = [
      {
        code: 'recipe-cycle',
        recipes: ['vanilla-sponge', 'victoria-sponge'],
        message: 'Vanilla sponge contains itself: Vanilla sponge → Victoria sponge → Vanilla sponge. Remove one of these lines.',
      },
    ];
    answer(400, { statusCode: 400, code: 'recipe-cycle', message: problems[0]!.message, problems });
    const error = await apiClient.put('/recipes/victoria-sponge', {}).catch((e: unknown) => e);
    expect(error).toMatchObject({ status: 400, code: 'recipe-cycle', fields: [], problems });
  });

  it('shows the server’s own words when its database cannot be reached (503)', async () => {
    const message = 'Crumbproof cannot reach its database just now, so this could not be done. Try again in a moment.';
    answer(503, { statusCode: 503, code: 'database-unavailable', message });
    await expect(apiClient.get('/ingredients')).rejects.toMatchObject({ status: 503, code: 'database-unavailable', message });
  });

  it('explains an error answer that has no body', async () => {
    answer(502);
    await expect(apiClient.get('/me')).rejects.toMatchObject({ status: 502, code: 'internal' });
  });

  it('explains a request that never reached the server', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    await expect(apiClient.get('/me')).rejects.toMatchObject({
      status: 0,
      code: 'network',
      message: 'Crumbproof could not reach the server. Check the connection and try again.',
    });
  });
});

describe('apiClient and the kitchen', () => {
  afterEach(() => forgetKitchen());

  it('names no kitchen before one is chosen', async () => {
    const fetchMock = answer(200, {});
    await apiClient.get('/me');
    const init = (fetchMock.mock.calls[0] as unknown as [string, RequestInit])[1];
    expect(init.headers).not.toHaveProperty(KITCHEN_HEADER);
  });

  it('names the chosen kitchen in the header of every request, and remembers it for the person', async () => {
    const fetchMock = answer(200, {});
    workIn(4, 2);
    await apiClient.get('/counter/products');
    await apiClient.post('/counter/questions', { product: 'brownie' });
    for (const call of fetchMock.mock.calls as unknown as [string, RequestInit][]) {
      expect(call[1].headers).toMatchObject({ [KITCHEN_HEADER]: '2' });
    }
    expect(storedKitchen(4)).toBe(2);
    expect(storedKitchen(5)).toBeNull();
  });

  it('puts the kitchen in the address of what the browser opens itself', () => {
    expect(withKitchen('/api/labels/runs/42/pdf')).toBe('/api/labels/runs/42/pdf');
    workIn(4, 2);
    expect(withKitchen('/api/labels/runs/42/pdf')).toBe('/api/labels/runs/42/pdf?kitchen=2');
    expect(withKitchen('/api/audit/export.csv?from=2026-12-01')).toBe('/api/audit/export.csv?from=2026-12-01&kitchen=2');
  });
});
