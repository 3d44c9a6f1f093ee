// Reads the rows of an uploaded CSV file or .xlsx workbook on a worker thread (spreadsheet.ts
// starts it), so a large or hostile file never holds up the server's other requests. It imports
// packages and types only: under jest it is compiled on its own, outside jest's module registry.
import { constants, setPriority } from 'node:os';
import { Readable } from 'node:stream';
import { parentPort, workerData } from 'node:worker_threads';
import type * as ExcelJS from 'exceljs';
import type * as PapaParse from 'papaparse';
import type { Cell } from './import-columns';

const request = workerData as Partial<ParseRequest> | null;

// Reading a file is background work. On Linux the nice value belongs to each thread, so this
// lowers the priority of this worker's thread alone, before it loads and parses anything: where
// the cores are busy, the main thread's requests are answered first.
if (parentPort && request?.read === 'spreadsheet') {
  try {
    setPriority(constants.priority.PRIORITY_BELOW_NORMAL);
  } catch {
    // Lowering a priority is allowed everywhere it is supported; elsewhere the read runs as it is.
  }
}

/* eslint-disable @typescript-eslint/no-require-imports -- loaded once the priority is lowered (imports would load first) */
const excel = require('exceljs') as typeof ExcelJS;
const Papa = require('papaparse') as typeof PapaParse;
/** The one function of file-type used here (as in common/multipart-upload.ts); ESM only, loaded through require(esm). */
const { fileTypeFromBuffer } = require('file-type') as {
  fileTypeFromBuffer: (bytes: Uint8Array) => Promise<{ ext: string; mime: string } | undefined>;
};
/* eslint-enable @typescript-eslint/no-require-imports -- the rest of the file imports as usual */

const XLSX_MIME = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

export interface ParseRequest {
  /** Marks the data the worker is started with. */
  read: 'spreadsheet';
  bytes: Uint8Array;
  /** The most ingredient rows (under the header) and columns a file may have. */
  maxRows: number;
  maxColumns: number;
}

export interface ParsedRow {
  /** 1-based row number as a spreadsheet program shows it (the header is row 1). */
  row: number;
  cells: Cell[];
}

/**
 * The rows read; or why the file is refused (one sentence naming the limit or the damage); or,
 * for a file that is neither CSV text nor an .xlsx workbook, the type found in its bytes.
 */
export type ParseResult =
  | { format: 'csv' | 'xlsx'; header: Cell[]; rows: ParsedRow[]; problems: string[] }
  | { refused: string }
  | { otherType: { ext: string; mime: string } };

const damaged = { refused: 'The workbook could not be read; it may be damaged. Save it again as .xlsx, or as CSV UTF-8.' };
const ONLY = 'Only CSV files and Excel workbooks (.xlsx) can be imported; this file is';

/** 0 → A, 25 → Z, 26 → AA. */
export function columnLetter(i: number): string {
  return i < 26 ? String.fromCharCode(65 + i) : columnLetter(Math.floor(i / 26) - 1) + String.fromCharCode(65 + (i % 26));
}

const tooWide = (row: number, column: number, max: number) =>
  `Row ${row} has a value in column ${columnLetter(column - 1)}; an import reads at most ${max} columns (A to ${columnLetter(max - 1)}). ` +
  `Delete the cells beyond column ${columnLetter(max - 1)}, or copy the ingredient columns to a new sheet.`;
const tooLong = (max: number) => `The file has more than ${max} ingredient rows; import at most ${max} at a time.`;

const hasValue = (c: Cell) => c !== null && !(typeof c === 'string' && c.trim() === '');
const isBlank = (cells: Cell[]) => !cells.some(hasValue);

/** Decides by content (magic numbers, the whole file) what the file is, then reads it. */
export async function parseSpreadsheet(req: ParseRequest): Promise<ParseResult> {
  const found = await fileTypeFromBuffer(req.bytes);
  if (found?.mime === XLSX_MIME) return readXlsx(req);
  if (found) return { otherType: { ext: found.ext, mime: found.mime } };
  return readCsv(req);
}

function readCsv({ bytes, maxRows, maxColumns }: ParseRequest): ParseResult {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return { refused: `${ONLY} not UTF-8 text; save the spreadsheet as .xlsx or as CSV UTF-8.` };
  }
  // eslint-disable-next-line no-control-regex -- control characters are what this looks for
  if (/[\u0000-\u0008\u000e-\u001f]/.test(text)) return { refused: `${ONLY} not a recognised type.` };
  let header: Cell[] = [];
  const rows: ParsedRow[] = [];
  const problems: string[] = [];
  let refused: string | null = null;
  let n = 0;
  Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), {
    skipEmptyLines: false,
    header: false,
    step: (result, parser) => {
      n += 1;
      for (const e of result.errors) if (e.code !== 'UndetectableDelimiter') problems.push(`Row ${n}: ${e.message}.`);
      const cells = result.data.map((c): Cell => (c === '' ? null : c));
      const last = lastValued(cells);
      if (last > maxColumns) refused = tooWide(n, last, maxColumns);
      else if (n === 1) header = cells;
      else if (!isBlank(cells) && rows.push({ row: n, cells }) > maxRows) refused = tooLong(maxRows);
      if (refused) parser.abort();
    },
  });
  return refused ? { refused } : { format: 'csv', header, rows, problems };
}

/** The 1-based column of the last cell with a value; 0 when none has. */
function lastValued(cells: Cell[]): number {
  for (let i = cells.length - 1; i >= 0; i--) if (hasValue(cells[i])) return i + 1;
  return 0;
}

/**
 * Streams the first visible worksheet row by row, reading only the cells the file holds, and stops
 * at the first row past the limits: a sheet with one cell in column XFD is refused at that cell,
 * without building the 16,384 columns before it.
 */
async function readXlsx({ bytes, maxRows, maxColumns }: ParseRequest): Promise<ParseResult> {
  const reader = new excel.stream.xlsx.WorkbookReader(Readable.from([Buffer.from(bytes)]), {
    worksheets: 'emit',
    sharedStrings: 'cache',
    styles: 'cache',
    hyperlinks: 'ignore',
    entries: 'ignore',
  });
  let header: Cell[] = [];
  const rows: ParsedRow[] = [];
  let found = false;
  try {
    for await (const sheet of reader) {
      if (found || !isFirstVisible(reader, sheet)) continue;
      found = true;
      for await (const r of sheet) {
        if (!Number.isInteger(r.number) || r.number < 1) return damaged;
        const cells: Cell[] = [];
        let beyond = 0;
        r.eachCell({ includeEmpty: false }, (cell, col) => {
          const value = cellValue(cell.value);
          if (col <= maxColumns) cells[col - 1] = value;
          else if (hasValue(value)) beyond ||= col;
        });
        if (beyond) return { refused: tooWide(r.number, beyond, maxColumns) };
        const dense = Array.from(cells, (c): Cell => c ?? null);
        if (r.number === 1) header = dense;
        else if (!isBlank(dense) && rows.push({ row: r.number, cells: dense }) > maxRows) return { refused: tooLong(maxRows) };
      }
    }
  } catch {
    return damaged;
  }
  if (!found) return { refused: 'The workbook has no worksheet.' };
  return { format: 'xlsx', header, rows, problems: [] };
}

interface SheetEntry {
  id: number | string;
  state?: string;
}

/** Whether this worksheet is the first one not hidden in the workbook's order (or the first, when all are). */
function isFirstVisible(reader: ExcelJS.stream.xlsx.WorkbookReader, sheet: ExcelJS.stream.xlsx.WorksheetReader): boolean {
  const sheets = (reader as unknown as { model?: { sheets?: SheetEntry[] } }).model?.sheets ?? [];
  const own = sheet as unknown as SheetEntry;
  const first = sheets.find((s) => s.state !== 'hidden' && s.state !== 'veryHidden') ?? sheets[0];
  return !first || String(first.id) === String(own.id);
}

/** A workbook cell as text, number or yes/no: formulas give their result, rich text its text. */
function cellValue(v: ExcelJS.CellValue): Cell {
  if (v === null || v === undefined) return null;
  if (typeof v === 'number' || typeof v === 'string' || typeof v === 'boolean') return v;
  if (v instanceof Date) return v.toISOString().slice(0, 10);
  if ('richText' in v) return v.richText.map((t) => t.text).join('');
  if ('hyperlink' in v) return v.text;
  if ('error' in v) return v.error;
  if ('result' in v) return v.result === undefined ? null : cellValue(v.result);
  return null;
}

const port = parentPort;
if (port && request?.read === 'spreadsheet') {
  let answered = false;
  // exceljs's streaming reader leaves its promise pending when a damaged zip stops yielding
  // entries; the worker then has nothing left to do and would exit without an answer.
  process.once('beforeExit', () => {
    if (!answered) port.postMessage(damaged);
  });
  // A failure here (never a refusal, which is a result) ends the worker with an error event.
  void parseSpreadsheet(request as ParseRequest).then((result) => {
    answered = true;
    port.postMessage(result);
  });
}
