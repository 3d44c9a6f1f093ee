import type { BookIngredient } from './book';

/**
 * The spreadsheet import of ingredients: `POST /api/ingredients/import/preview` answers an
 * `ImportPreview` (nothing saved), `POST /api/ingredients/import` an `ImportResult` (all rows or
 * none).
 */

/** A column the import understands, as documented in every preview. */
export interface ImportColumn {
  /** The header to use; matched case-insensitively, also under its other names. */
  header: string;
  /** Other headers accepted for the column. */
  aliases: string[];
  /** The ingredient field it fills: 'contains', 'nutrition.fat', … */
  field: string;
  required: boolean;
  description: string;
}

export type ImportAction = 'create' | 'update' | 'unchanged';

export interface ImportRow {
  /** 1-based row number as the spreadsheet program shows it (the header is row 1). */
  row: number;
  /** The ingredient the row would become; null when its cells do not make a valid ingredient. */
  ingredient: BookIngredient | null;
  action: ImportAction;
  /** Each names the row, the column and the value: "row 4, column Contains: 'hazlenut' is not…". */
  problems: string[];
  /** The ingredient the row was compared against; null when the row has no id. */
  base: ImportRowBase | null;
}

/** The state of a row's ingredient when the preview compared the row against it. */
export interface ImportRowBase {
  /** Its current revision then; null when no ingredient had the row's id. */
  revision: number | null;
  /** A token of that state: the import is refused when it no longer matches (someone saved or created the ingredient since). */
  token: string;
}

export interface ImportCounts {
  create: number;
  update: number;
  unchanged: number;
  withProblems: number;
}

export interface ImportPreview {
  format: 'csv' | 'xlsx';
  columns: ImportColumn[];
  /** How the file is read: what an empty cell, 'none' and an absent column mean. */
  rules: string[];
  /** Problems with the file as a whole (unknown or missing columns, no rows, …). */
  problems: string[];
  rows: ImportRow[];
  summary: ImportCounts;
  /**
   * Every row's token, as the import takes it back in its form field `basis` (a JSON object from
   * row number to token): the import saves nothing when any row's ingredient changed since.
   */
  basis: string;
}

/** The summary of what was imported, and each ingredient written. */
export interface ImportResult extends ImportCounts {
  /** Every ingredient written, with its new revision; unchanged rows are not written. */
  written: { id: string; revision: number }[];
}
