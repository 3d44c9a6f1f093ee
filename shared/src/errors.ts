import type { Unit } from './allergens';
import type { BookIngredient, BookRecipe } from './book';
import type { ItemChange } from './item-diff';

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
  /** Sent with stale-base: the saves made since the revision the editor started from. */
  stale?: StaleBase;
  /** Sent with stale-preview: every row of the spreadsheet whose ingredient changed since the preview. */
  staleRows?: StaleImportRow[];
}

/** A save someone else made after the revision an editor started from. */
export interface OtherSave {
  revision: number;
  authorId: number | null;
  /** Null when the save has no author (an import from the command line) or the account is gone. */
  authorName: string | null;
  /** ISO 8601. */
  savedAt: string;
  note: string;
  /** What this save changed against the revision before it. */
  changes: ItemChange[];
}

/**
 * A save refused because the item was saved by someone else since the editor loaded it
 * (code stale-base, 409). Nothing was saved; the editor shows who changed what.
 */
export interface StaleBase {
  kind: 'ingredient' | 'recipe';
  id: string;
  name: string;
  /** The revision the editor started from (baseRevision of the request). */
  baseRevision: number;
  currentRevision: number;
  /** Every save after the base, oldest first. */
  saves: OtherSave[];
  /** What all of them changed together, from the base to the current revision. */
  changes: ItemChange[];
  /** The item as it stands now: its current revision, which a new save must name as its base. */
  current: BookIngredient | BookRecipe;
}

/** A spreadsheet row whose ingredient was created or revised after the preview (code stale-preview, 409). */
export interface StaleImportRow {
  /** The spreadsheet's row number, as the preview named it. */
  row: number;
  id: string;
  /** The revision the preview compared against; null when the ingredient did not exist then. */
  previewRevision: number | null;
  /** The revision now; null when the ingredient no longer exists. */
  currentRevision: number | null;
  /** Who saved the current revision and when (ISO 8601); null when nobody is recorded. */
  authorName: string | null;
  savedAt: string | null;
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
  /** The person works in several kitchens and the request named none (KITCHEN_HEADER): the app asks them to choose. */
  'kitchen-required',
  'not-found',
  'conflict',
  'stale-base',
  'stale-preview',
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
  /** The API cannot reach its database just now (stopped, restarting, unreachable): nothing could be read or saved. */
  'database-unavailable',
  /** The store of uploaded files (the folder, or the S3-compatible bucket) cannot be reached or used just now: no file was read or kept. */
  'storage-unavailable',
  /** A row names a stored file that is not in the store (deleted or lost there): it must be restored from a backup. */
  'stored-file-missing',
  /** A stored file's bytes no longer match the checksum kept with it: it is never served, and must be restored from a backup. */
  'stored-file-damaged',
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
