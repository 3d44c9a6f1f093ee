import type { BookProblem, ErrorCode, FieldError, StaleBase, StaleImportRow } from '@crumbproof/shared';

/**
 * The one error type services throw; the exception filter maps its code to HTTP. `fields` name
 * bad inputs of the request; `problems` are the reasons a book cannot be declared, with their ids.
 */
export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: FieldError[],
    readonly problems?: BookProblem[],
    /** What a stale-base or stale-preview refusal shows: the other saves, or the rows that changed. */
    readonly stale?: { stale?: StaleBase; staleRows?: StaleImportRow[] },
  ) {
    super(message);
  }
}

export function httpStatusOf(code: ErrorCode): number {
  switch (code) {
    case 'validation':
    case 'book-invalid':
    case 'recipe-cycle':
    case 'unknown-reference':
    case 'unweighable-line':
    case 'duplicate-id':
    case 'kitchen-required':
      return 400;
    case 'unauthenticated':
    case 'bad-credentials':
      return 401;
    case 'forbidden':
      return 403;
    case 'not-found':
      return 404;
    case 'conflict':
    case 'stale-base':
    case 'stale-preview':
    case 'approval-needed':
      return 409;
    case 'too-many-requests':
      return 429;
    case 'too-large':
      return 413;
    case 'label-refused':
      return 422;
    case 'internal':
    case 'stored-file-missing':
    case 'stored-file-damaged':
      return 500;
    case 'database-unavailable':
    case 'storage-unavailable':
      return 503;
    default: {
      const never: never = code;
      return never;
    }
  }
}
