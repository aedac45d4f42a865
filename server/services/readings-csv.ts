/**
 * Water tests to and from CSV (pure). Columns: shared/schemas/reading.ts `CSV_COLUMNS`;
 * nitrogen values are in the row's `basis`, temperature in °C, times ISO 8601 with an offset.
 */
import Papa from 'papaparse';
import { fieldErrors } from '../../shared/api-error.js';
import {
  CSV_COLUMNS,
  fromMgN,
  readingCreateSchema,
  type CsvColumn,
  type CsvRow,
  type CsvRowError,
} from '../../shared/schemas/reading.js';
import type { ReadingItem } from '../../shared/schemas/tank.js';

/**
 * Characters that make a spreadsheet read a cell as a formula (OWASP "CSV injection"):
 * = + - @ tab and carriage return. Such cells get a leading apostrophe, which spreadsheets
 * show as text; import strips it again.
 */
const FORMULA_START = /^[=+\-@\t\r]/;

export function escapeCsvCell(value: string): string {
  return FORMULA_START.test(value) ? `'${value}` : value;
}

/** Undoes `escapeCsvCell`: an apostrophe followed by a formula character. */
export function unescapeCsvCell(value: string): string {
  return value.startsWith("'") && FORMULA_START.test(value.slice(1)) ? value.slice(1) : value;
}

/** Twelve significant digits: exact for any kit reading, without binary tails like …0000004. */
const num = (v: number | null) => (v === null ? '' : String(Number(v.toPrecision(12))));

/** The readings as a CSV file (header first), each nitrogen value in the basis its kit showed. */
export function readingsToCsv(readings: readonly ReadingItem[]): string {
  const data = readings.map((r) =>
    [
      r.takenAt,
      r.basis,
      num(r.tanMgN === null ? null : fromMgN(r.tanMgN, 'tanMgN', r.basis)),
      num(r.no2MgN === null ? null : fromMgN(r.no2MgN, 'no2MgN', r.basis)),
      num(r.no3MgN === null ? null : fromMgN(r.no3MgN, 'no3MgN', r.basis)),
      num(r.ph),
      num(r.temperatureC),
      num(r.khDkh),
      r.note ?? '',
    ].map(escapeCsvCell),
  );
  return Papa.unparse({ fields: [...CSV_COLUMNS], data }, { newline: '\r\n', quotes: false }) + '\r\n';
}

/** Which CSV column each field of `readingCreateSchema` comes from. */
const COLUMN_OF: Record<string, CsvColumn> = {
  takenAt: 'taken_at',
  basis: 'basis',
  tan: 'total_ammonia',
  no2: 'nitrite',
  no3: 'nitrate',
  ph: 'ph',
  temperatureC: 'temperature_c',
  khDkh: 'kh_dkh',
  note: 'note',
};

const NUMBER = /^[+]?(\d+(\.\d*)?|\.\d+)$/;
const DATE_ONLY = /^\d{4}-\d{2}-\d{2}$/;

export interface ParsedCsv {
  rows: CsvRow[];
  errors: CsvRowError[];
  /** Data rows in the file (valid or not). */
  dataRowCount: number;
}

/**
 * Parses and checks a readings CSV. Every row is checked with the same schema as a typed
 * test; problems come back per line and column. Two rows with the same time are duplicates.
 * `line` counts the header as line 1 (a quoted note spanning lines shifts later numbers).
 */
export function parseReadingsCsv(text: string, maxRows: number): ParsedCsv {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim().toLowerCase(),
  });
  const errors: CsvRowError[] = [];
  const fields = parsed.meta.fields ?? [];
  const dataRowCount = parsed.data.length;
  for (const f of fields) {
    if (!(CSV_COLUMNS as readonly string[]).includes(f)) {
      errors.push({ line: 1, column: f, message: `Unknown column "${f}". Use: ${CSV_COLUMNS.join(', ')}.` });
    }
  }
  for (const required of ['taken_at', 'basis'] as const) {
    if (!fields.includes(required)) errors.push({ line: 1, column: required, message: `The header needs a "${required}" column.` });
  }
  if (errors.length > 0 || dataRowCount > maxRows) return { rows: [], errors, dataRowCount };

  for (const e of parsed.errors) {
    if (e.row !== undefined && e.code !== 'UndetectableDelimiter') {
      errors.push({ line: e.row + 2, column: null, message: `This row could not be read: ${e.message}.` });
    }
  }

  const rows: CsvRow[] = [];
  const seen = new Map<number, number>();
  parsed.data.forEach((raw, i) => {
    const line = i + 2;
    const rowErrors: CsvRowError[] = [];
    const cell = (c: CsvColumn) => unescapeCsvCell((raw[c] ?? '').trim());
    const numberCell = (c: CsvColumn): number | null | string => {
      const s = cell(c);
      if (s === '') return null;
      if (!NUMBER.test(s)) {
        rowErrors.push({ line, column: c, message: `"${s.slice(0, 20)}" is not a number (use a dot for decimals).` });
        return s;
      }
      return Number(s);
    };
    const takenAtRaw = cell('taken_at');
    const input = {
      takenAt: DATE_ONLY.test(takenAtRaw) ? `${takenAtRaw}T12:00:00Z` : takenAtRaw,
      basis: cell('basis'),
      tan: numberCell('total_ammonia'),
      no2: numberCell('nitrite'),
      no3: numberCell('nitrate'),
      ph: numberCell('ph'),
      temperatureC: numberCell('temperature_c'),
      khDkh: numberCell('kh_dkh'),
      note: cell('note'),
    };
    if (rowErrors.length === 0) {
      const result = readingCreateSchema.safeParse(input);
      if (!result.success) {
        for (const [path, message] of Object.entries(fieldErrors(result.error.issues))) {
          const column = COLUMN_OF[path.split('.')[0]] ?? null;
          rowErrors.push({ line, column, message: path === 'basis' ? 'Write N or ion.' : message });
        }
      } else {
        const r = result.data;
        const at = Date.parse(r.takenAt);
        const earlier = seen.get(at);
        if (earlier !== undefined) rowErrors.push({ line, column: 'taken_at', message: `Same time as line ${earlier}: a duplicate.` });
        else seen.set(at, line);
        rows.push({
          line,
          takenAt: new Date(at).toISOString(),
          basis: r.basis,
          tan: r.tan ?? null,
          no2: r.no2 ?? null,
          no3: r.no3 ?? null,
          ph: r.ph ?? null,
          temperatureC: r.temperatureC ?? null,
          khDkh: r.khDkh ?? null,
          note: r.note ?? '',
        });
      }
    }
    errors.push(...rowErrors);
  });
  errors.sort((a, b) => a.line - b.line);
  return { rows, errors, dataRowCount };
}
