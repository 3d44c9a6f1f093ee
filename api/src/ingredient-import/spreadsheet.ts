import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { AppError } from '../common/app-error';
import { describeType, detectType } from '../specifications/multipart-upload';
import type { Cell } from './import-columns';

export interface SheetRow {
  /** 1-based row number as a spreadsheet program shows it (the header is row 1). */
  row: number;
  cells: Cell[];
}

export interface Sheet {
  format: 'csv' | 'xlsx';
  header: Cell[];
  rows: SheetRow[];
  /** Problems with the file as a whole (e.g. a quote left open). */
  problems: string[];
}

export const MAX_IMPORT_ROWS = 5000;
const XLSX_MIME = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

const refuse = (what: string) =>
  new AppError('validation', `Only CSV files and Excel workbooks (.xlsx) can be imported; this file is ${what}.`, [
    { path: 'file', message: `Only CSV files and Excel workbooks (.xlsx) can be imported; this file is ${what}.` },
  ]);

/**
 * Decides by content what the file is (an .xlsx workbook, or CSV text) and reads its rows.
 * A workbook is read from its first visible worksheet.
 */
export async function readSheet(bytes: Buffer): Promise<Sheet> {
  if (bytes.length === 0) throw new AppError('validation', 'The file is empty.', [{ path: 'file', message: 'The file is empty.' }]);
  const type = await detectType(bytes);
  if (type?.mime === XLSX_MIME) return readXlsx(bytes);
  if (type?.ext === 'cfb') throw refuse('an older Office file (such as .xls); save it as .xlsx or as CSV UTF-8');
  if (type?.ext === 'zip') throw refuse('a ZIP archive without the structure of an .xlsx workbook');
  if (type) throw refuse(describeType(type));
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw refuse('not UTF-8 text; save the spreadsheet as .xlsx or as CSV UTF-8');
  }
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u0008\u000e-\u001f]/.test(text)) throw refuse('not a recognised type');
  return readCsv(text.replace(/^\uFEFF/, ''));
}

function readCsv(text: string): Sheet {
  const parsed = Papa.parse<string[]>(text, { skipEmptyLines: false, header: false });
  const problems = parsed.errors
    .filter((e) => e.code !== 'UndetectableDelimiter')
    .map((e) => `${e.row !== undefined ? `Row ${e.row + 1}: ` : ''}${e.message}.`);
  const [header = [], ...rest] = parsed.data;
  const rows = rest.map((cells, i) => ({ row: i + 2, cells: cells.map((c) => (c === '' ? null : c)) }));
  return finish({ format: 'csv', header, rows, problems });
}

async function readXlsx(bytes: Buffer): Promise<Sheet> {
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(bytes as unknown as ExcelJS.Buffer);
  } catch {
    throw new AppError('validation', 'The workbook could not be read; it may be damaged. Save it again as .xlsx, or as CSV UTF-8.', [
      { path: 'file', message: 'The workbook could not be read.' },
    ]);
  }
  const sheet = workbook.worksheets.find((w) => w.state !== 'hidden' && w.state !== 'veryHidden') ?? workbook.worksheets[0];
  if (!sheet)
    throw new AppError('validation', 'The workbook has no worksheet.', [{ path: 'file', message: 'The workbook has no worksheet.' }]);
  const width = sheet.columnCount;
  const read = (r: ExcelJS.Row): Cell[] => Array.from({ length: width }, (_, i) => cellValue(r.getCell(i + 1).value));
  const header = read(sheet.getRow(1));
  const rows: SheetRow[] = [];
  sheet.eachRow({ includeEmpty: false }, (r, n) => {
    if (n > 1) rows.push({ row: n, cells: read(r) });
  });
  return finish({ format: 'xlsx', header, rows, problems: [] });
}

/** A workbook cell as text, number or yes/no: formulas give their result, rich text its text. */
function cellValue(v: ExcelJS.CellValue): Cell {
  if (v === null || v === undefined) return null;
  if (typeof v === 'number' || typeof v === 'string' || typeof v === 'boolean') return v;
  if (v instanceof Date) return v.toISOString().slice(0, 10);
  if ('richText' in v) return v.richText.map((t) => t.text).join('');
  if ('hyperlink' in v) return v.text;
  if ('error' in v) return v.error;
  if ('result' in v) return v.result === undefined ? null : cellValue(v.result as ExcelJS.CellValue);
  return null;
}

function finish(sheet: Sheet): Sheet {
  const isBlank = (cells: Cell[]) => cells.every((c) => c === null || (typeof c === 'string' && c.trim() === ''));
  const rows = sheet.rows.filter((r) => !isBlank(r.cells));
  const problems = [...sheet.problems];
  if (isBlank(sheet.header)) problems.push('Row 1 must be the header row naming the columns (id, name, contains, …); it is empty.');
  else if (rows.length === 0) problems.push('The file has no ingredient rows under the header.');
  if (rows.length > MAX_IMPORT_ROWS) problems.push(`The file has ${rows.length} rows; import at most ${MAX_IMPORT_ROWS} at a time.`);
  return { ...sheet, rows, problems };
}
