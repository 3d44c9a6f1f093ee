import { PayloadTooLargeException, applyDecorators } from '@nestjs/common';
import { ApiBody, ApiConsumes } from '@nestjs/swagger';
import type { FastifyRequest } from 'fastify';
import type {} from '@fastify/multipart';
import { AppError } from './app-error';

/** The one function of file-type used here. */
type FileTypeFromBuffer = (bytes: Uint8Array) => Promise<{ ext: string; mime: string } | undefined>;
// eslint-disable-next-line @typescript-eslint/no-require-imports -- file-type is ESM only; Node loads it through require(esm), jest transforms it
const { fileTypeFromBuffer } = require('file-type') as { fileTypeFromBuffer: FileTypeFromBuffer };

export interface UploadedFile {
  /** The name the browser sent, sanitised (no folders, no control or reserved characters); may be empty. */
  filename: string;
  bytes: Buffer;
}

/** A multipart form with at most one file, in the field `file`, and plain text fields. */
export interface Upload {
  file: UploadedFile | null;
  fields: Record<string, string>;
}

/** The most one uploaded file may weigh (the same as the app-wide multipart limit). */
import { MAX_UPLOAD_BYTES } from './limits';

export const MAX_FILE_BYTES = MAX_UPLOAD_BYTES;

export interface DetectedType {
  ext: string;
  mime: string;
}

/**
 * Reads the whole multipart form. Every problem with the form itself becomes a plain message:
 * a file over the upload limit is a 413, anything else malformed a 400 naming what is wrong.
 */
export async function readUpload(req: FastifyRequest, allowedFields: readonly string[], maxBytes = MAX_FILE_BYTES): Promise<Upload> {
  if (!req.isMultipart()) {
    throw new AppError('validation', "Send the form as multipart/form-data, with the file in a field named 'file'.", [
      { path: 'file', message: 'Attach a file.' },
    ]);
  }
  const boundaryProblem = checkBoundary(req.headers['content-type']);
  if (boundaryProblem) throw unreadable(boundaryProblem);
  const upload: Upload = { file: null, fields: {} };
  const problems: { path: string; message: string }[] = [];
  let partsSeen = 0;
  try {
    for await (const part of req.parts({ limits: { fileSize: maxBytes, files: 1 } })) {
      partsSeen += 1;
      if (part.type === 'file') {
        const bytes = await part.toBuffer();
        if (part.fieldname !== 'file') {
          problems.push({ path: part.fieldname, message: `Attach the file in the field 'file', not '${part.fieldname}'.` });
        } else {
          upload.file = { filename: safeFilename(part.filename), bytes };
        }
      } else if (!allowedFields.includes(part.fieldname)) {
        problems.push({
          path: part.fieldname,
          message: `This form has no field '${part.fieldname}'; it takes ${['file', ...allowedFields].map((f) => `'${f}'`).join(', ')}.`,
        });
      } else if (part.fieldname in upload.fields) {
        problems.push({ path: part.fieldname, message: `Send '${part.fieldname}' once.` });
      } else {
        upload.fields[part.fieldname] = typeof part.value === 'string' ? part.value : JSON.stringify(part.value ?? '');
      }
    }
  } catch (err) {
    throw uploadError(err, maxBytes, partsSeen);
  }
  if (problems.length > 0) {
    throw new AppError('validation', `The form needs attention. ${problems.map((p) => `${p.path}: ${p.message}`).join(' ')}`, problems);
  }
  return upload;
}

const unreadable = (why: string) => new AppError('validation', `The form could not be read: ${why}`, [{ path: 'file', message: why }]);

/**
 * The boundary that frames each part (RFC 2046 section 5.1.1: 1 to 70 characters), as the
 * Content-Type names it; a message when it is missing or cannot be one.
 */
function checkBoundary(contentType: string | undefined): string | null {
  const found = /;\s*boundary\s*=\s*(?:"([^"]*)"|([^;\s]*))/i.exec(contentType ?? '');
  const boundary = found ? (found[1] ?? found[2]) : '';
  if (boundary === '')
    return 'its Content-Type names no boundary (multipart/form-data; boundary=…). Send the form as a browser does, with FormData.';
  if (boundary.length > 70) return `its boundary is ${boundary.length} characters long; RFC 2046 allows at most 70.`;
  return null;
}

function uploadError(err: unknown, maxBytes: number, partsSeen: number): unknown {
  const code = (err as { code?: string })?.code;
  const status = (err as { statusCode?: number })?.statusCode;
  const message = err instanceof Error ? err.message : '';
  if (code === 'FST_REQ_FILE_TOO_LARGE') {
    return new PayloadTooLargeException(
      `The file is larger than ${Math.round(maxBytes / (1024 * 1024))} MB, the most an upload may be. Attach a smaller file.`,
    );
  }
  if (code === 'FST_FILES_LIMIT')
    return new AppError('validation', 'Attach one file only.', [{ path: 'file', message: 'Attach one file only.' }]);
  if (code === 'FST_PARTS_LIMIT' || code === 'FST_FIELDS_LIMIT') return new AppError('validation', 'The form has too many fields.');
  // The multipart parser (busboy) reports a body that stops before its closing boundary this way;
  // a body in which the boundary never appears ends the same way, before any part.
  if (/unexpected end of multipart data/i.test(message)) {
    return unreadable(
      partsSeen === 0
        ? 'the body does not start with the boundary that its Content-Type names, so no part of it could be found. Send the form again as a browser does, with FormData.'
        : 'the body ends in the middle of a part, before the closing boundary; the upload was cut short. Send it again.',
    );
  }
  if (code === 'FST_MP_PREMATURE_CLOSE') return unreadable('the upload was closed before the whole form arrived. Send it again.');
  if (typeof status === 'number' && status >= 400 && status < 500) {
    return unreadable('the form data is incomplete or malformed. Send it again.');
  }
  return err;
}

/**
 * How much of the start of a file its type is judged from: file-type needs the first 4100 bytes
 * for the types it knows, and a ZIP container (.docx, .xlsx) names what it holds in its first
 * entries. Reading on through the whole file would let a ZIP of many small entries hold up the
 * server for every request.
 */
const DETECT_BYTES = 16 * 1024;

/** What the bytes are, found by their content (magic numbers), never by the name or declared type. */
export async function detectType(bytes: Buffer): Promise<DetectedType | undefined> {
  const found = await fileTypeFromBuffer(bytes.subarray(0, DETECT_BYTES));
  return found ? { ext: found.ext, mime: found.mime } : undefined;
}

/** "a GIF file (image/gif)", or "not a recognised type". */
export function describeType(type: DetectedType | undefined): string {
  if (!type) return 'not a recognised type';
  const name = type.ext.toUpperCase();
  return `${/^[AEFHILMNORSX]/.test(name) ? 'an' : 'a'} ${name} file (${type.mime})`;
}

/**
 * Control characters (Unicode category Cc: C0, DEL and C1) and the bidirectional controls of
 * Unicode Standard Annex #9 (embeddings and overrides U+202A–U+202E, isolates U+2066–U+2069, the
 * marks U+200E, U+200F and U+061C), which can make "invoice\u202Egnp.exe" read as "invoiceexe.png",
 * and the line and paragraph separators U+2028 and U+2029.
 */
// eslint-disable-next-line no-control-regex -- control characters are what this matches
const CONTROL_CHARACTERS = /[\u0000-\u001f\u007f-\u009f\u061c\u200e\u200f\u2028-\u202e\u2066-\u2069]/g;

const MAX_FILENAME = 200;

/** Keeps the last path segment, drops control, bidirectional and reserved characters, and keeps it short. */
export function safeFilename(name: string | undefined): string {
  const base = (name ?? '').split(/[\\/]/).pop() ?? '';
  let clean = base
    .normalize('NFC')
    .replace(CONTROL_CHARACTERS, '')
    .replace(/["<>:|?*]/g, '')
    .replace(/\s+/g, ' ')
    .trim()
    .replace(/^\.+/, '');
  if (clean.length > MAX_FILENAME) {
    const dot = clean.lastIndexOf('.');
    const ext = dot > 0 && clean.length - dot <= 10 ? clean.slice(dot) : '';
    clean = clean.slice(0, MAX_FILENAME - ext.length) + ext;
  }
  return clean;
}

/** Other names of the same type's extension (file-type names JPEG 'jpg'). */
const SAME_EXTENSION: Record<string, string[]> = { jpg: ['jpeg', 'jpe', 'jfif'], tif: ['tiff'] };

/**
 * The name with the extension of the type found in the bytes: kept when it already ends so (in
 * any case), a short extension that names another type replaced ("spec.png" of a PDF becomes
 * "spec.pdf"), and the extension added otherwise ("version 1.2" becomes "version 1.2.pdf").
 */
export function withExtension(name: string, ext: string, fallback = 'file'): string {
  const dot = name.lastIndexOf('.');
  const current = dot > 0 ? name.slice(dot + 1) : '';
  const lower = current.toLowerCase();
  if (lower === ext || SAME_EXTENSION[ext]?.includes(lower)) return name;
  const stem = (/^[a-z][a-z0-9]{0,3}$/i.test(current) ? name.slice(0, dot) : name).replace(/[.\s]+$/, '') || fallback;
  return `${stem.slice(0, MAX_FILENAME - ext.length - 1)}.${ext}`;
}

/** Documents a multipart form with a `file` and text fields in the OpenAPI document. */
export function ApiUpload(fields: Record<string, { description: string; format?: string; required?: boolean }> = {}) {
  return applyDecorators(
    ApiConsumes('multipart/form-data'),
    ApiBody({
      schema: {
        type: 'object',
        required: [
          'file',
          ...Object.entries(fields)
            .filter(([, f]) => f.required)
            .map(([k]) => k),
        ],
        properties: {
          file: { type: 'string', format: 'binary' },
          ...Object.fromEntries(
            Object.entries(fields).map(([k, f]) => [
              k,
              { type: 'string', description: f.description, ...(f.format ? { format: f.format } : {}) },
            ]),
          ),
        },
      },
    }),
  );
}
