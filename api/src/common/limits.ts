/** The largest file an upload may carry (supplier specifications, spreadsheets). */
export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;

/** The largest JSON body a request may carry, the recipe book's import aside. */
export const MAX_JSON_BODY_BYTES = 2 * 1024 * 1024;

/**
 * The largest recipe book an import may carry: a chain's book of 1,500 ingredients and 8,000
 * recipes is about 2.5 MB, four times that about 10 MB.
 */
export const MAX_BOOK_BYTES = 32 * 1024 * 1024;

/** A route's own body limit, set by `@RouteConfig({ bodyLimit })` and applied by the app (app.factory.ts). */
export interface BodyLimitConfig {
  bodyLimit?: number;
}

/** The most ingredient rows (under the header row) one spreadsheet import may hold. */
export const MAX_IMPORT_ROWS = 5000;

/** The most columns a spreadsheet import reads (A to CV); the import knows fewer than 30. */
export const MAX_IMPORT_COLUMNS = 100;

/** How long reading one spreadsheet may take before it is given up. */
export const SPREADSHEET_READ_SECONDS = 20;

/** The memory one spreadsheet read may use (the worker thread's old-generation heap). */
export const SPREADSHEET_READ_MEMORY_MB = 256;

/** How many spreadsheets are read at once; further uploads wait their turn. */
export const SPREADSHEET_READS_AT_ONCE = 2;
