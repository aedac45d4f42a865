import type { DataSource } from 'typeorm';
import { isUniqueViolation, type Db } from '../data-source.js';
import { storedReadingValues, type CsvRow, type CsvRowError, type ReadingCreateInput } from '../../shared/schemas/reading.js';
import { Reading } from '../entities/reading.js';
import { conflict } from '../errors.js';

/** The unique index on readings (tank_id, taken_at) (migration 1796316400000). */
const ONE_TEST_PER_TIME = 'readings_tank_id_taken_at_key';
const timeTaken = () =>
  conflict('A test at this date and time is already logged for this tank.', { takenAt: 'A test at this time is already logged.' });

/**
 * Logs a test on a tank the caller owns; a second test at the same moment is refused (409
 * naming takenAt). The look first gives the common case its answer; the unique index decides
 * between two requests racing.
 */
export async function addReading(ds: Db, tankId: string, input: ReadingCreateInput): Promise<Reading> {
  const repo = ds.getRepository(Reading);
  const takenAt = new Date(input.takenAt);
  if (await repo.existsBy({ tankId, takenAt })) throw timeTaken();
  const reading = repo.create({
    tankId,
    takenAt,
    ...storedReadingValues(input),
    ph: input.ph ?? null,
    temperatureC: input.temperatureC ?? null,
    khDkh: input.khDkh ?? null,
    basis: input.basis,
    note: input.note ?? '',
  });
  try {
    return await repo.save(reading);
  } catch (err) {
    if (isUniqueViolation(err, ONE_TEST_PER_TIME)) throw timeTaken();
    throw err;
  }
}

/** A page of the tank's tests, newest first. */
export async function listReadings(ds: DataSource, tankId: string, page: number, pageSize: number) {
  const [readings, total] = await ds.getRepository(Reading).findAndCount({
    where: { tankId },
    order: { takenAt: 'DESC', createdAt: 'DESC' },
    skip: (page - 1) * pageSize,
    take: pageSize,
  });
  return { readings, total };
}

/** Every test of the tank, newest first (for export). */
export async function allReadings(ds: DataSource, tankId: string): Promise<Reading[]> {
  return ds.getRepository(Reading).find({ where: { tankId }, order: { takenAt: 'DESC', createdAt: 'DESC' } });
}

/** Deletes one test, only if it belongs to the tank (whose owner the route checked). */
export async function deleteReading(ds: DataSource, tankId: string, readingId: string): Promise<boolean> {
  const result = await ds.getRepository(Reading).delete({ id: readingId, tankId });
  return (result.affected ?? 0) > 0;
}

/** Rows whose time is already logged for the tank, as row errors. */
/** Anything that runs SQL: the data source, or a transaction's entity manager. */
type Queryable = { query(sql: string, params?: unknown[]): Promise<any> };

export async function duplicateErrors(ds: Queryable, tankId: string, rows: readonly CsvRow[]): Promise<CsvRowError[]> {
  if (rows.length === 0) return [];
  const found: { taken_at: Date }[] = await ds.query(
    `SELECT taken_at FROM readings WHERE tank_id = $1 AND taken_at = ANY($2::timestamptz[])`,
    [tankId, rows.map((r) => r.takenAt)],
  );
  const logged = new Set(found.map((f) => new Date(f.taken_at).getTime()));
  return rows
    .filter((r) => logged.has(Date.parse(r.takenAt)))
    .map((r) => ({ line: r.line, column: 'taken_at', message: 'A test at this time is already logged for this tank: a duplicate.' }));
}

/**
 * Writes all rows in ONE transaction, after checking again (inside it, with the tank row
 * locked so two imports cannot interleave) that none is a duplicate. Returns the duplicates
 * instead of writing anything when there are some.
 */
export async function importReadings(ds: Db, tankId: string, rows: readonly CsvRow[]): Promise<{ imported: Reading[]; duplicates: CsvRowError[] }> {
  try {
    return await insertAll(ds, tankId, rows);
  } catch (err) {
    // A single test logged at one of these times while the import ran (it does not take the
    // tank lock): the unique index refused the batch, which wrote nothing.
    if (!isUniqueViolation(err, ONE_TEST_PER_TIME)) throw err;
    return { imported: [], duplicates: await duplicateErrors(ds, tankId, rows) };
  }
}

function insertAll(ds: Db, tankId: string, rows: readonly CsvRow[]): Promise<{ imported: Reading[]; duplicates: CsvRowError[] }> {
  // Nested in a keyed request's transaction this is a savepoint, so a refusal leaves it usable.
  return ds.transaction(async (em) => {
    await em.query(`SELECT id FROM tanks WHERE id = $1 FOR UPDATE`, [tankId]);
    const duplicates = await duplicateErrors(em, tankId, rows);
    if (duplicates.length > 0) return { imported: [], duplicates };
    const repo = em.getRepository(Reading);
    const entities = rows.map((r) =>
      repo.create({
        tankId,
        takenAt: new Date(r.takenAt),
        ...storedReadingValues({ basis: r.basis, tan: r.tan, no2: r.no2, no3: r.no3 }),
        ph: r.ph,
        temperatureC: r.temperatureC,
        khDkh: r.khDkh,
        basis: r.basis,
        note: r.note,
      }),
    );
    // Chunked inserts keep each statement's parameter count well below PostgreSQL's limit.
    // `insert` fills in each entity's generated id.
    for (let i = 0; i < entities.length; i += 500) await repo.insert(entities.slice(i, i + 500));
    return { imported: entities, duplicates: [] };
  });
}
