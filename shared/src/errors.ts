import type { Unit } from './allergens';

/**
 * Every error the API returns has this body. `code` is stable for programs,
 * `message` is a sentence for people, `fields` names each bad input of the request, and
 * `problems` names, with the ids involved, each reason a recipe book cannot be declared.
 */
export interface ApiErrorBody {
  statusCode: number;
  code: ErrorCode;
  message: string;
  fields?: FieldError[];
  /** Sent with recipe-cycle, unknown-reference, unweighable-line and duplicate-id: every problem found, not only the first. */
  problems?: BookProblem[];
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
  'label-refused',
  /** A label print of a product whose current declaration a manager has not approved. */
  'approval-needed',
  'internal',
] as const;
export type ErrorCode = (typeof ERROR_CODES)[number];

/** What checkBook refuses. Nothing is declared from a book with problems. */
export const BOOK_PROBLEM_CODES = ['recipe-cycle', 'unknown-reference', 'unweighable-line', 'duplicate-id'] as const;
export type BookProblemCode = (typeof BOOK_PROBLEM_CODES)[number];

/** Two items of the book (ingredients or recipes) have the same id. */
export interface DuplicateIdProblem {
  code: 'duplicate-id';
  message: string;
  id: string;
}

/**
 * Recipes that contain themselves. `recipes` are the ids in order from the first recipe found:
 * each uses the next, and the last uses the first (['a'] is a recipe with a line using itself).
 */
export interface RecipeCycleProblem {
  code: 'recipe-cycle';
  message: string;
  recipes: string[];
}

/** A recipe names an id that is neither an ingredient nor a recipe of the book: on a line, or in its sale's QUID list. */
export type UnknownReferenceProblem =
  | {
      code: 'unknown-reference';
      message: string;
      recipe: string;
      field: 'use';
      /** 1-based, as the message counts: line 1 is lines[0]. */
      line: number;
      use: string;
    }
  | {
      code: 'unknown-reference';
      message: string;
      recipe: string;
      field: 'sale.quid';
      use: string;
    };

/**
 * A line whose quantity cannot be turned into grams. `needs` says what would weigh it: the
 * ingredient `use` has no `gPerMl` or `gEach`, or `use` is a recipe and the line must be in grams.
 */
export interface UnweighableLineProblem {
  code: 'unweighable-line';
  message: string;
  recipe: string;
  field: 'unit';
  /** 1-based, as the message counts: line 1 is lines[0]. */
  line: number;
  use: string;
  unit: Unit;
  needs: 'gPerMl' | 'gEach' | 'grams';
}

export type BookProblem = DuplicateIdProblem | RecipeCycleProblem | UnknownReferenceProblem | UnweighableLineProblem;
