/**
 * Every error the API returns has this body. `code` is stable for programs,
 * `message` is a sentence for people, `fields` names each bad input.
 */
export interface ApiErrorBody {
  statusCode: number;
  code: ErrorCode;
  message: string;
  fields?: FieldError[];
}
export interface FieldError {
  path: string;
  message: string;
}
export const ERROR_CODES = [
  'validation',
  'unauthenticated',
  'bad-credentials',
  'forbidden',
  'not-found',
  'conflict',
  'too-many-requests',
  'too-large',
  'recipe-cycle',
  'unknown-reference',
  'unweighable-line',
  'duplicate-id',
  'book-invalid',
  'internal',
] as const;
export type ErrorCode = (typeof ERROR_CODES)[number];
