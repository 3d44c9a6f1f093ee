/** The largest file an upload may carry (supplier specifications, spreadsheets). */
export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;

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
