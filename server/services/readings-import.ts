import type { DataSource } from 'typeorm';
import type { Db } from '../data-source.js';
import { CSV_IMPORT_MAX_ROWS, type CsvRowError, type ImportPreview } from '../../shared/schemas/reading.js';
import type { Reading } from '../entities/reading.js';
import { importRejected, tooManyRows } from '../errors.js';
import { parseReadingsCsv } from './readings-csv.js';
import { duplicateErrors, importReadings } from './readings.js';

/** Row errors as an ApiError `fields` map: `rows.<line>.<column>` → message. */
function rowFields(errors: readonly CsvRowError[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const e of errors) {
    const key = `rows.${e.line}.${e.column ?? 'row'}`;
    if (!(key in out)) out[key] = e.message;
  }
  return out;
}

/** A CSV file's tests checked against the tank's stored ones, without writing; 422 past the row cap. */
export async function previewImport(ds: DataSource, tankId: string, text: string): Promise<ImportPreview> {
  const parsed = parseReadingsCsv(text, CSV_IMPORT_MAX_ROWS);
  if (parsed.dataRowCount > CSV_IMPORT_MAX_ROWS) {
    throw tooManyRows(`A file can hold at most ${CSV_IMPORT_MAX_ROWS} tests; this one has ${parsed.dataRowCount}.`, {
      file: `At most ${CSV_IMPORT_MAX_ROWS} rows.`,
    });
  }
  const dupes = await duplicateErrors(ds, tankId, parsed.rows);
  const errors = [...parsed.errors, ...dupes].sort((a, b) => a.line - b.line);
  if (parsed.dataRowCount === 0 && errors.length === 0) errors.push({ line: 1, column: null, message: 'The file has no tests in it.' });
  return { rows: parsed.rows, errors, canImport: errors.length === 0 };
}

/**
 * Imports every test of the file or none: 422 `import_rejected` naming the rows when any is
 * wrong or already logged (checked again while writing, under the tank's lock).
 */
export async function commitImport(ds: DataSource, db: Db, tankId: string, text: string): Promise<Reading[]> {
  const checked = await previewImport(ds, tankId, text);
  if (!checked.canImport) throw importRejected('Nothing was imported: fix the rows named and upload the file again.', rowFields(checked.errors));
  const result = await importReadings(db, tankId, checked.rows);
  if (result.duplicates.length > 0) throw importRejected('Nothing was imported: some tests are already logged.', rowFields(result.duplicates));
  return result.imported;
}
