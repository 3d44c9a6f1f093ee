import { isApiError } from './api-client';

/**
 * What a form does with a refused or failed write: each of the API's field messages goes on
 * the control it names; the message of a refusal that names none of them, or the fallback when
 * the answer was not the API's, is the form's own message (returned, for an alert above the form).
 */
export function placeFieldErrors<F extends string>(
  error: unknown,
  fields: readonly F[],
  setError: (field: F, error: { message: string }) => void,
  fallback: string,
): string | null {
  if (!isApiError(error)) return fallback;
  let placed = false;
  for (const field of error.fields) {
    if ((fields as readonly string[]).includes(field.path)) {
      setError(field.path as F, { message: field.message });
      placed = true;
    }
  }
  return placed ? null : error.message;
}
