import { randomUUID } from 'node:crypto';
import { In, type DataSource } from 'typeorm';
import type { AppDeps } from '../deps.js';
import { Plan } from '../entities/plan.js';
import { Reading } from '../entities/reading.js';
import { Tank } from '../entities/tank.js';
import { User } from '../entities/user.js';
import { readingAlertMail } from '../mail/templates/reading-alert.js';
import { runEngine } from '../services/engine-runs.js';
import { planScenarioOrThrow } from '../services/plan-forecasts.js';
import type { WaterTestJudgement } from '../../simulation/water-test.js';
import { forecastFindings, judgeReading, limitFindings, type ReadingValues } from './alert-findings.js';
import { planDay, type JobDeps } from './reminders.js';
import { sendOnce } from './send-once.js';

export const READING_CHECK_QUEUE = 'reading-check';
export const IMPORT_CHECK_QUEUE = 'readings-import-check';

/**
 * An import alerts only on tests taken in the last IMPORT_ALERT_RECENT_DAYS days: that is about
 * the span over which an ammonia or nitrite spike still tells something about the water now
 * (common practice: cycling keepers test every day or two, and a week-old value has usually
 * been acted on or replaced). Older history imported later is a record, not an emergency.
 */
export const IMPORT_ALERT_RECENT_DAYS = 7;
/** An import's alert lists at most this many alarming tests, most recent first. */
export const IMPORT_ALERT_MAX_LISTED = 3;

export { FORECAST_FACTOR, FORECAST_MARGIN_SHARE, forecastFindings, judgeReading, limitFindings, type ReadingValues } from './alert-findings.js';

/** A stored reading with the pH and temperature it is judged at (the tank's when the test has none). */
interface CheckedReading {
  reading: Reading;
  values: ReadingValues;
  judgement: WaterTestJudgement;
}

const valuesOf = (reading: Reading, tank: Tank): ReadingValues => ({
  tanMgN: reading.tanMgN,
  no2MgN: reading.no2MgN,
  ph: reading.ph ?? tank.ph,
  temperatureC: reading.temperatureC ?? tank.temperatureC,
});

/** Forecast findings for each reading, from one forecast of the active plan over the latest reading's day. */
async function activePlanFindings(ds: DataSource, tank: Tank, checked: readonly CheckedReading[]): Promise<Map<string, string[]>> {
  const out = new Map<string, string[]>();
  const plan = await ds.getRepository(Plan).findOneBy({ tankId: tank.id, status: 'active' });
  if (!plan) return out;
  const days = checked.map((c) => planDay(plan.startDate, c.reading.takenAt.toISOString().slice(0, 10)));
  const lastDay = Math.max(...days);
  if (lastDay < 0) return out;
  // The plan's own forecast, from the same start as on the plan page (its tests, fit and account: shared/tank-start.ts).
  const { scenario } = await planScenarioOrThrow(ds, { plan, tank });
  // On the engine pool like every forecast: a heavy plan may take a worker's time, never the main thread's.
  const { value: series } = await runEngine<{ days: number[]; tanMgN: number[]; no2MgN: number[] }>({
    kind: 'forecast-series',
    scenario,
    horizonDays: Math.max(lastDay + 1, 2),
  });
  checked.forEach(({ reading, judgement }, k) => {
    if (days[k] < 0) return;
    const i = series.days.findIndex((d) => d >= days[k]);
    if (i < 0) return;
    out.set(reading.id, forecastFindings(judgement, series.tanMgN[i], series.no2MgN[i]));
  });
  return out;
}

/**
 * The one answer to "is this reading alarming": its findings against the limits and against the
 * active plan's forecast, per reading id (readings without findings are left out). Used for a
 * single logged test and for an import alike.
 */
export async function readingFindings(ds: DataSource, logger: JobDeps['logger'], tank: Tank, readings: readonly Reading[]): Promise<Map<string, string[]>> {
  const checked = readings.map((reading) => {
    const values = valuesOf(reading, tank);
    return { reading, values, judgement: judgeReading(values) };
  });
  let forecast = new Map<string, string[]>();
  try {
    forecast = await activePlanFindings(ds, tank, checked);
  } catch (err) {
    // A plan the engine refuses must not stop the limit alert.
    logger.log('warn', 'jobs.alert_forecast_failed', { tankId: tank.id, readings: readings.length, error: String(err) });
  }
  const out = new Map<string, string[]>();
  for (const { reading, values, judgement } of checked) {
    const findings = [...limitFindings(values, judgement), ...(forecast.get(reading.id) ?? [])];
    if (findings.length > 0) out.set(reading.id, findings);
  }
  return out;
}

/** Checks one logged reading and e-mails the tank's owner once (key `alert:<readingId>`). */
export async function checkReading({ dataSource: ds, mailer, config, logger }: JobDeps, readingId: string): Promise<boolean> {
  const reading = await ds.getRepository(Reading).findOneBy({ id: readingId });
  if (!reading) return false;
  const tank = await ds.getRepository(Tank).findOneByOrFail({ id: reading.tankId });
  const findings = (await readingFindings(ds, logger, tank, [reading])).get(reading.id) ?? [];
  if (findings.length === 0) return false;
  const owner = await ds.getRepository(User).findOneByOrFail({ id: tank.ownerId });
  const content = readingAlertMail({ displayName: owner.displayName, tankName: tank.name, findings, tankLink: `${config.appUrl}/tanks/${tank.id}` });
  const sent = await sendOnce(ds, mailer, `alert:${reading.id}`, owner.id, owner.email, content);
  logger.log('info', sent ? 'jobs.alert_sent' : 'jobs.alert_already_sent', { readingId });
  return sent;
}

/**
 * Call after a reading is saved; never throws. Enqueues its check on the PostgreSQL-backed
 * queue (one job per reading and hour, singleton key), so the request does not wait for the
 * check and any server process may run it. With jobs off (JOBS=off) it only logs.
 */
export async function onReadingLogged(deps: Pick<AppDeps, 'jobs' | 'logger'>, reading: Pick<Reading, 'id'>): Promise<void> {
  if (!deps.jobs) {
    deps.logger.log('info', 'jobs.disabled_reading_not_checked', { readingId: reading.id });
    return;
  }
  try {
    await deps.jobs.send(READING_CHECK_QUEUE, { readingId: reading.id }, { singletonKey: `reading:${reading.id}`, singletonSeconds: 3600 });
  } catch (err) {
    // The reading is saved either way; a missed alert must not turn the save into an error.
    deps.logger.log('error', 'jobs.enqueue_failed', { queue: READING_CHECK_QUEUE, readingId: reading.id, error: String(err) });
  }
}

export interface ImportCheckJob {
  tankId: string;
  /** The import's recent readings (taken in the last IMPORT_ALERT_RECENT_DAYS days). */
  readingIds: string[];
  /** One id per import: the send-once key, so a retried or doubled job never sends twice. */
  importId: string;
}

/** "2026-11-29 08:00 UTC": the server does not know the keeper's time zone. */
const utcMinute = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

/**
 * Checks an import's recent readings with the same rule as a single logged test and e-mails the
 * owner at most once per import (key `alert:import:<importId>`), listing the most recent
 * alarming tests rather than one message per row.
 */
export async function checkImportedReadings({ dataSource: ds, mailer, config, logger }: JobDeps, job: ImportCheckJob): Promise<boolean> {
  if (job.readingIds.length === 0) return false;
  const readings = await ds.getRepository(Reading).find({ where: { id: In(job.readingIds), tankId: job.tankId }, order: { takenAt: 'DESC' } });
  if (readings.length === 0) return false;
  const tank = await ds.getRepository(Tank).findOneByOrFail({ id: job.tankId });
  const findings = await readingFindings(ds, logger, tank, readings);
  const alarming = readings.filter((r) => findings.has(r.id));
  if (alarming.length === 0) return false;
  const listed = alarming.slice(0, IMPORT_ALERT_MAX_LISTED);
  const lines = listed.flatMap((r) => findings.get(r.id)!.map((f) => `Test of ${utcMinute(r.takenAt)}: ${f}`));
  const more = alarming.length - listed.length;
  if (more > 0) lines.push(`${more} earlier imported ${more === 1 ? 'test' : 'tests'} from the last ${IMPORT_ALERT_RECENT_DAYS} days also ${more === 1 ? 'needs' : 'need'} attention.`);
  const owner = await ds.getRepository(User).findOneByOrFail({ id: tank.ownerId });
  const content = readingAlertMail({
    displayName: owner.displayName,
    tankName: tank.name,
    intro: `Of the water tests you imported for ${tank.name}, these recent ones need attention (most recent first):`,
    findings: lines,
    tankLink: `${config.appUrl}/tanks/${tank.id}`,
  });
  const sent = await sendOnce(ds, mailer, `alert:import:${job.importId}`, owner.id, owner.email, content);
  logger.log('info', sent ? 'jobs.import_alert_sent' : 'jobs.import_alert_already_sent', { tankId: tank.id, importId: job.importId, alarming: alarming.length });
  return sent;
}

/**
 * Call after a CSV import is committed; never throws. Picks the imported tests taken in the last
 * IMPORT_ALERT_RECENT_DAYS days and enqueues one check for them all (none when every test is
 * older). With jobs off (JOBS=off) it only logs.
 */
export async function onReadingsImported(
  deps: Pick<AppDeps, 'jobs' | 'logger'>,
  tankId: string,
  imported: readonly Pick<Reading, 'id' | 'takenAt'>[],
): Promise<void> {
  const since = Date.now() - IMPORT_ALERT_RECENT_DAYS * 24 * 3600 * 1000;
  const recent = imported.filter((r) => r.takenAt.getTime() > since);
  if (recent.length === 0) return;
  const job: ImportCheckJob = { tankId, readingIds: recent.map((r) => r.id), importId: randomUUID() };
  if (!deps.jobs) {
    deps.logger.log('info', 'jobs.disabled_import_not_checked', { tankId, readings: recent.length });
    return;
  }
  try {
    await deps.jobs.send(IMPORT_CHECK_QUEUE, job, { singletonKey: `import:${job.importId}` });
  } catch (err) {
    // The import is saved either way; a missed alert must not turn it into an error.
    deps.logger.log('error', 'jobs.enqueue_failed', { queue: IMPORT_CHECK_QUEUE, tankId, error: String(err) });
  }
}
