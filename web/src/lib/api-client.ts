import type { ApiErrorBody, BookProblem, ErrorCode, FieldError, StaleBase, StaleImportRow } from '@crumbproof/shared';
import { kitchenHeaders } from './kitchen-choice';

/** Codes the browser adds to the API's own: the request never arrived, or the answer was unreadable. */
export type ClientErrorCode = ErrorCode | 'network' | 'bad-response';

/**
 * The one error every server call throws: the API's body, or a plain sentence when there was none.
 * `fields` name bad inputs of the request; `problems` are the reasons a recipe book cannot be
 * declared, with the ids they involve (the recipe, its line, the recipes of a cycle in order).
 */
export class ApiError extends Error {
  readonly status: number;
  readonly code: ClientErrorCode;
  readonly fields: FieldError[];
  readonly problems: BookProblem[];
  /** With stale-base: the saves someone else made since the revision the editor started from. */
  readonly stale: StaleBase | null;
  /** With stale-preview: the spreadsheet rows whose ingredient changed since the preview. */
  readonly staleRows: StaleImportRow[];

  constructor(
    status: number,
    code: ClientErrorCode,
    message: string,
    fields: FieldError[] = [],
    problems: BookProblem[] = [],
    changed: { stale?: StaleBase; staleRows?: StaleImportRow[] } = {},
  ) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
    this.problems = problems;
    this.stale = changed.stale ?? null;
    this.staleRows = changed.staleRows ?? [];
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

interface RequestOptions {
  body?: unknown;
  signal?: AbortSignal;
}

const API_BASE = '/api';

function isErrorBody(value: unknown): value is ApiErrorBody {
  return (
    typeof value === 'object' &&
    value !== null &&
    typeof (value as ApiErrorBody).code === 'string' &&
    typeof (value as ApiErrorBody).message === 'string'
  );
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text === '') return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    throw new ApiError(
      response.status,
      'bad-response',
      `The server sent an answer Crumbproof could not read (status ${response.status}). Try again in a moment.`,
    );
  }
}

async function request<T>(method: Method, path: string, options: RequestOptions = {}): Promise<T> {
  // Every request names the kitchen it is for (the API refuses one the person has no role in).
  const headers: Record<string, string> = { Accept: 'application/json', ...kitchenHeaders() };
  // FormData (file uploads) goes as multipart: the browser writes the Content-Type with its boundary.
  const isForm = typeof FormData !== 'undefined' && options.body instanceof FormData;
  if (options.body !== undefined && !isForm) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(`${API_BASE}${path}`, {
      method,
      headers,
      credentials: 'include',
      body: options.body === undefined ? undefined : isForm ? (options.body as FormData) : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError(0, 'network', 'Crumbproof could not reach the server. Check the connection and try again.');
  }

  const body = await readJson(response);
  if (!response.ok) {
    if (isErrorBody(body)) {
      throw new ApiError(response.status, body.code, body.message, body.fields ?? [], body.problems ?? [], {
        stale: body.stale,
        staleRows: body.staleRows,
      });
    }
    throw new ApiError(
      response.status,
      response.status >= 500 ? 'internal' : 'bad-response',
      `The server answered with status ${response.status} and no explanation. Try again in a moment.`,
    );
  }
  return body as T;
}

/**
 * The one way the web talks to the API: same origin, cookie credentials, JSON both ways, and
 * the chosen kitchen named in every request's header.
 * A FormData body is sent as multipart/form-data (file uploads); the answer is still JSON.
 */
export const apiClient = {
  get: <T>(path: string, options?: Omit<RequestOptions, 'body'>) => request<T>('GET', path, options),
  post: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'body'>) => request<T>('POST', path, { ...options, body }),
  patch: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'body'>) => request<T>('PATCH', path, { ...options, body }),
  put: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'body'>) => request<T>('PUT', path, { ...options, body }),
  delete: <T>(path: string, options?: Omit<RequestOptions, 'body'>) => request<T>('DELETE', path, options),
};
