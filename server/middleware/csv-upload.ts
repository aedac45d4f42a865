import type { RequestHandler } from 'express';
import multer from 'multer';
import { CSV_IMPORT_MAX_BYTES } from '../../shared/schemas/reading.js';
import { badRequest, payloadTooLarge, unsupportedMediaType, validationFailed } from '../errors.js';

/*
 * A CSV upload (water tests to import): `parseUpload` reads the multipart body, `csvText` checks
 * the file is text CSV and gives its contents. The routes' "validate" step for a file.
 */

/** Types a browser or OS may give a .csv file. */
const CSV_MIME_TYPES = new Set([
  'text/csv',
  'text/plain',
  'application/csv',
  'text/comma-separated-values',
  'application/vnd.ms-excel',
  'application/octet-stream',
]);

const notCsv = () => unsupportedMediaType('Upload a CSV file: plain text, values separated by commas.');

/** One file, in memory, at most CSV_IMPORT_MAX_BYTES; the name the client gives is never used. */
const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: CSV_IMPORT_MAX_BYTES, files: 1, fields: 4, parts: 5, fieldSize: 1024 },
}).single('file');

/**
 * Parses the upload, with multer's refusals in the API's error vocabulary. Anything else the
 * parser throws (busboy: no boundary, a cut-off body, a malformed part header) is the client's
 * malformed multipart body, so a 400 naming it, never a 500.
 */
export const parseUpload: RequestHandler = (req, res, next) => {
  upload(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') return next(payloadTooLarge());
      return next(validationFailed({ file: 'Send one CSV file in the "file" field.' }));
    }
    const detail = err instanceof Error ? err.message.replace(/^Multipart:\s*/i, '') : 'unreadable';
    next(badRequest(`The upload is not a well-formed multipart/form-data body (${detail}).`, { file: 'Upload the file again: the request body was cut off or malformed.' }));
  });
};

/** The uploaded CSV as text; 400 without a file, 415 when it is not a text CSV. */
export function csvText(req: { file?: Express.Multer.File; is(type: string): string | false | null }): string {
  if (!req.is('multipart/form-data')) throw unsupportedMediaType('Upload the CSV file as multipart/form-data.');
  const file = req.file;
  if (!file) throw validationFailed({ file: 'Choose a CSV file.' });
  if (!CSV_MIME_TYPES.has(file.mimetype.toLowerCase()) || !/\.(csv|txt)$/i.test(file.originalname)) throw notCsv();
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(file.buffer);
  } catch {
    throw notCsv();
  }
  // A picture or a zip renamed to .csv usually still decodes partly; NUL bytes give it away.
  if (text.includes('\u0000')) throw notCsv();
  return text;
}
