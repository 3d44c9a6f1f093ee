import { access } from 'node:fs/promises';
import { extname, join } from 'node:path';
import { Worker, type WorkerOptions } from 'node:worker_threads';
import { AppError } from '../../common/app-error';
import {
  MAX_IMPORT_COLUMNS,
  MAX_IMPORT_ROWS,
  SPREADSHEET_READ_MEMORY_MB,
  SPREADSHEET_READ_SECONDS,
  SPREADSHEET_READS_AT_ONCE,
} from '../../common/limits';
import { describeType } from '../../common/multipart-upload';
import type { Cell } from './import-columns';
import type { ParsedRow, ParseRequest, ParseResult } from './spreadsheet.worker';

export type SheetRow = ParsedRow;

export interface Sheet {
  format: 'csv' | 'xlsx';
  header: Cell[];
  rows: SheetRow[];
  /** Problems with the file as a whole (e.g. a quote left open). */
  problems: string[];
}

const refusal = (message: string) => new AppError('validation', message, [{ path: 'file', message }]);
const refuse = (what: string) => refusal(`Only CSV files and Excel workbooks (.xlsx) can be imported; this file is ${what}.`);

/**
 * Decides by content what the file is (an .xlsx workbook, or CSV text) and reads its rows, both on
 * a worker thread, so that no file holds up other requests. A workbook is read from its first
 * visible worksheet; a file past the limits of rows and columns is refused, naming the limit.
 */
export async function readSheet(bytes: Buffer): Promise<Sheet> {
  if (bytes.length === 0) throw refusal('The file is empty.');
  const read = await inTurn(() => readOnWorker({ read: 'spreadsheet', bytes, maxRows: MAX_IMPORT_ROWS, maxColumns: MAX_IMPORT_COLUMNS }));
  if ('refused' in read) throw refusal(read.refused);
  if ('otherType' in read) {
    const type = read.otherType;
    if (type.ext === 'cfb') throw refuse('an older Office file (such as .xls); save it as .xlsx or as CSV UTF-8');
    if (type.ext === 'zip') throw refuse('a ZIP archive without the structure of an .xlsx workbook');
    throw refuse(describeType(type));
  }
  return finish(read);
}

/**
 * The worker's file sits beside this one with the same extension: .js in the built API, where Node
 * loads it as it is; .ts under jest, whose transform does not reach worker threads, so the worker
 * compiles it with @swc/core (the compiler jest uses here, a development dependency) and runs it
 * with a require rooted at the file.
 */
const WORKER_FILE = join(__dirname, `spreadsheet.worker${extname(__filename)}`);

function startWorker(request: ParseRequest): Worker {
  const options: WorkerOptions = {
    workerData: request,
    resourceLimits: { maxOldGenerationSizeMb: SPREADSHEET_READ_MEMORY_MB },
  };
  if (extname(WORKER_FILE) === '.js') return new Worker(WORKER_FILE, options);
  const compileAndRun = `
    const file = ${JSON.stringify(WORKER_FILE)};
    const requireHere = require('node:module').createRequire(file);
    const { code } = requireHere('@swc/core').transformFileSync(file, {
      swcrc: false,
      jsc: { parser: { syntax: 'typescript' }, target: 'es2022' },
      module: { type: 'commonjs' },
    });
    const module_ = { exports: {} };
    new Function('exports', 'require', 'module', '__filename', '__dirname', code)(
      module_.exports, requireHere, module_, file, require('node:path').dirname(file));`;
  return new Worker(compileAndRun, { ...options, eval: true });
}

/**
 * Checked once, asynchronously, on the main thread: a build without the worker file fails with a
 * plain error, and libuv's thread pool, which the whole process shares, is made here at normal
 * priority, not by a worker that has lowered its own (a thread inherits its creator's nice value).
 */
let workerFileFound: Promise<void> | null = null;

/** One read on its own worker thread, given up after the time limit or past the memory limit. */
async function readOnWorker(request: ParseRequest): Promise<ParseResult> {
  workerFileFound ??= access(WORKER_FILE).catch(() => {
    workerFileFound = null;
    throw new Error(`The spreadsheet reader ${WORKER_FILE} is missing: build the API again (npm run build).`);
  });
  await workerFileFound;
  return new Promise((resolve, reject) => {
    const worker = startWorker(request);
    let settled = false;
    const settle = (then: () => void) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      void worker.terminate();
      then();
    };
    const timer = setTimeout(
      () =>
        settle(() =>
          reject(
            refusal(
              `The file took longer than ${SPREADSHEET_READ_SECONDS} seconds to read, the most an import may take. Save the ingredient rows alone as CSV UTF-8 and import that.`,
            ),
          ),
        ),
      SPREADSHEET_READ_SECONDS * 1000,
    );
    worker.once('message', (result: ParseResult) => settle(() => resolve(result)));
    worker.once('error', (err: Error & { code?: string }) =>
      settle(() =>
        reject(
          err.code === 'ERR_WORKER_OUT_OF_MEMORY'
            ? refusal(
                `The file needs more than ${SPREADSHEET_READ_MEMORY_MB} MB of memory to read, the most an import may use. Save the ingredient rows alone as CSV UTF-8 and import that.`,
              )
            : err,
        ),
      ),
    );
    worker.once('exit', (code) => settle(() => reject(new Error(`The spreadsheet reader stopped (exit code ${code}) without an answer.`))));
  });
}

let reading = 0;
const waiting: (() => void)[] = [];

/** Runs at most SPREADSHEET_READS_AT_ONCE reads together; a finished read hands its turn to the next. */
async function inTurn<T>(work: () => Promise<T>): Promise<T> {
  if (reading < SPREADSHEET_READS_AT_ONCE) reading += 1;
  else await new Promise<void>((resolve) => waiting.push(resolve));
  try {
    return await work();
  } finally {
    const next = waiting.shift();
    if (next) next();
    else reading -= 1;
  }
}

/** The file's own problems once its rows are read (blank rows were skipped on the worker). */
function finish(sheet: Sheet): Sheet {
  const blankHeader = sheet.header.every((c) => c === null || (typeof c === 'string' && c.trim() === ''));
  const problems = [...sheet.problems];
  if (blankHeader) problems.push('Row 1 must be the header row naming the columns (id, name, contains, …); it is empty.');
  else if (sheet.rows.length === 0) problems.push('The file has no ingredient rows under the header.');
  return { ...sheet, problems };
}
