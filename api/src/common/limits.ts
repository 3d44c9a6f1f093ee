/** The largest file an upload may carry (supplier specifications, spreadsheets). */
export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;
