import type { ImportResult, ReadingPage } from '../../shared/schemas/reading.js';
import type { ReadingItem } from '../../shared/schemas/tank.js';
import type { Reading } from '../entities/reading.js';

/** A water test as the API shows it (and the CSV export writes it). */
export function presentReading(r: Reading): ReadingItem {
  return {
    id: r.id,
    takenAt: r.takenAt.toISOString(),
    tanMgN: r.tanMgN,
    no2MgN: r.no2MgN,
    no3MgN: r.no3MgN,
    ph: r.ph,
    temperatureC: r.temperatureC,
    khDkh: r.khDkh,
    basis: r.basis,
    note: r.note ?? '',
  };
}

/** One page of a tank's tests, newest first. */
export function presentReadingPage(readings: readonly Reading[], page: { page: number; pageSize: number; total: number }): ReadingPage {
  return { readings: readings.map(presentReading), page: page.page, pageSize: page.pageSize, total: page.total };
}

/** The answer to a committed CSV import: how many tests it added. */
export function presentImportResult(imported: readonly Reading[]): ImportResult {
  return { imported: imported.length };
}
