import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import {
  CSV_IMPORT_MAX_BYTES,
  CSV_IMPORT_MAX_ROWS,
  readingCreateSchema,
  readingsQuerySchema,
  type CsvRowError,
  type ImportPreview,
} from '../../shared/schemas/reading.js';
import type { AppDeps } from '../deps.js';
import { onReadingLogged, onReadingsImported } from '../jobs/alerts.js';
import { AppError, badRequest, notFound, payloadTooLarge, validationFailed } from '../errors.js';
import { validateBody, validateQuery, validBody, validQuery } from '../middleware/validate.js';
import { afterCommit, requestDb } from '../middleware/request-db.js';
import { presentReading } from '../presenters/tank.js';
import { parseReadingsCsv, readingsToCsv } from '../services/readings-csv.js';
import { addReading, allReadings, deleteReading, duplicateErrors, importReadings, listReadings } from '../services/readings.js';

const uuid = z.string().uuid();

/** Types a browser or OS may give a .csv file. */
const CSV_MIME_TYPES = new Set([
  'text/csv',
  'text/plain',
  'application/csv',
  'text/comma-separated-values',
  'application/vnd.ms-excel',
  'application/octet-stream',
]);

const notCsv = () => new AppError(415, 'unsupported_media_type', 'Upload a CSV file: plain text, values separated by commas.');

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
const parseUpload: RequestHandler = (req, res, next) => {
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
function csvText(req: { file?: Express.Multer.File; is(type: string): string | false | null }): string {
  if (!req.is('multipart/form-data')) throw new AppError(415, 'unsupported_media_type', 'Upload the CSV file as multipart/form-data.');
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

function tooManyRows(count: number) {
  return new AppError(422, 'too_many_rows', `A file can hold at most ${CSV_IMPORT_MAX_ROWS} tests; this one has ${count}.`, {
    file: `At most ${CSV_IMPORT_MAX_ROWS} rows.`,
  });
}

/** Row errors as an ApiError `fields` map: `rows.<line>.<column>` → message. */
function rowFields(errors: readonly CsvRowError[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const e of errors) {
    const key = `rows.${e.line}.${e.column ?? 'row'}`;
    if (!(key in out)) out[key] = e.message;
  }
  return out;
}

/** Parses the upload and checks it against the tank's stored tests, without writing. */
async function preview(ds: AppDeps['dataSource'], tankId: string, text: string): Promise<ImportPreview> {
  const parsed = parseReadingsCsv(text, CSV_IMPORT_MAX_ROWS);
  if (parsed.dataRowCount > CSV_IMPORT_MAX_ROWS) throw tooManyRows(parsed.dataRowCount);
  const dupes = await duplicateErrors(ds, tankId, parsed.rows);
  const errors = [...parsed.errors, ...dupes].sort((a, b) => a.line - b.line);
  if (parsed.dataRowCount === 0 && errors.length === 0) errors.push({ line: 1, column: null, message: 'The file has no tests in it.' });
  return { rows: parsed.rows, errors, canImport: errors.length === 0 };
}

/** /api/tanks/:id/readings — mounted after auth and the tank-ownership check. */
export function readingsRouter(deps: AppDeps): Router {
  const ds = deps.dataSource;
  const router = Router({ mergeParams: true });
  const tankId = (req: { params: Record<string, unknown> }) => String(req.params.id);

  router.get('/', validateQuery(readingsQuerySchema), async (req, res) => {
    const { page, pageSize } = validQuery(req, readingsQuerySchema);
    const { readings, total } = await listReadings(ds, tankId(req), page, pageSize);
    res.json({ readings: readings.map(presentReading), page, pageSize, total });
  });

  router.post('/', validateBody(readingCreateSchema), async (req, res) => {
    const reading = await addReading(requestDb(req, ds), tankId(req), validBody(req, readingCreateSchema));
    // Alert check on the job queue (server/jobs/alerts.ts), once the test is committed; never throws.
    await afterCommit(req, () => onReadingLogged(deps, reading));
    res.status(201).json(presentReading(reading));
  });

  router.get('/export.csv', async (req, res) => {
    const csv = readingsToCsv((await allReadings(ds, tankId(req))).map(presentReading));
    const day = new Date().toISOString().slice(0, 10);
    res
      .status(200)
      .type('text/csv; charset=utf-8')
      .set('Content-Disposition', `attachment; filename="shoalshift-water-tests-${day}.csv"`)
      .set('X-Content-Type-Options', 'nosniff')
      .send(csv);
  });

  const withUpload: RequestHandler[] = [parseUpload];

  router.post('/import/preview', ...withUpload, async (req, res) => {
    res.json(await preview(ds, tankId(req), csvText(req)));
  });

  router.post('/import/commit', ...withUpload, async (req, res) => {
    const checked = await preview(ds, tankId(req), csvText(req));
    if (!checked.canImport) {
      throw new AppError(422, 'import_rejected', 'Nothing was imported: fix the rows named and upload the file again.', rowFields(checked.errors));
    }
    const result = await importReadings(requestDb(req, ds), tankId(req), checked.rows);
    if (result.duplicates.length > 0) {
      throw new AppError(422, 'import_rejected', 'Nothing was imported: some tests are already logged.', rowFields(result.duplicates));
    }
    // One alert check for the import's recent tests (server/jobs/alerts.ts); never throws.
    await afterCommit(req, () => onReadingsImported(deps, tankId(req), result.imported));
    res.status(201).json({ imported: result.imported.length });
  });

  router.delete('/:readingId', async (req, res) => {
    const id = uuid.safeParse(req.params.readingId);
    if (!id.success || !(await deleteReading(ds, tankId(req), id.data))) throw notFound('No such water test on this tank.');
    res.status(204).end();
  });

  return router;
}
