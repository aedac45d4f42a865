import type { DataSource } from 'typeorm';
import type { AppDeps } from '../deps.js';
import { Livestock } from '../entities/livestock.js';
import { Plan } from '../entities/plan.js';
import { Reading } from '../entities/reading.js';
import { Tank } from '../entities/tank.js';
import { User } from '../entities/user.js';
import { readingAlertMail } from '../mail/templates/reading-alert.js';
import { scenarioFromPlan } from '../services/scenario-from-plan.js';
import { freeAmmoniaFraction } from '../../simulation/chemistry.js';
import { forecastParsed } from '../../simulation/forecast.js';
import { defaultLimits } from '../../simulation/limits.js';
import { MOLAR_MASS } from '../../simulation/units.js';
import { planDay, type JobDeps } from './reminders.js';
import { sendOnce } from './send-once.js';

export const READING_CHECK_QUEUE = 'reading-check';

/**
 * "Far above the forecast": the reading is more than FORECAST_FACTOR times the forecast value
 * and above it by at least FORECAST_MARGIN_SHARE of the limit, so tiny values near zero do not
 * alarm (common practice: test kits read in steps of about 0.25 mg/L at the low end).
 */
export const FORECAST_FACTOR = 2;
export const FORECAST_MARGIN_SHARE = 0.5;

const fmt = (x: number) => (x >= 1 ? x.toFixed(2) : x.toPrecision(2));

export interface ReadingValues {
  tanMgN: number | null;
  no2MgN: number | null;
  ph: number;
  temperatureC: number;
}

/** Findings against the default limits (simulation/limits.ts) at the reading's pH and temperature. */
export function limitFindings(r: ReadingValues): string[] {
  const limits = defaultLimits({ ph: r.ph, temperatureC: r.temperatureC });
  const out: string[] = [];
  if (r.tanMgN !== null) {
    const freeNh3 = (r.tanMgN * freeAmmoniaFraction(r.temperatureC, r.ph) * MOLAR_MASS.NH3) / MOLAR_MASS.N;
    if (freeNh3 > limits.freeNh3.value)
      out.push(`Free ammonia ${fmt(freeNh3)} mg NH3/L (from total ammonia ${fmt(r.tanMgN)} mg N/L at pH ${r.ph}, ${r.temperatureC} °C) is over the limit of ${limits.freeNh3.value} mg NH3/L.`);
  }
  if (r.no2MgN !== null && r.no2MgN > limits.nitrite.value)
    out.push(`Nitrite ${fmt(r.no2MgN)} mg N/L is over the limit of ${limits.nitrite.value} mg N/L.`);
  return out;
}

/** Findings against the active plan's forecast on the reading's plan day. */
export function forecastFindings(r: ReadingValues, forecastTan: number, forecastNo2: number, limitTan: number, limitNo2: number): string[] {
  const out: string[] = [];
  const far = (value: number | null, expected: number, limit: number) =>
    value !== null && value > FORECAST_FACTOR * expected && value - expected > FORECAST_MARGIN_SHARE * limit;
  if (far(r.tanMgN, forecastTan, limitTan)) out.push(`Total ammonia ${fmt(r.tanMgN!)} mg N/L is far above the forecast of ${fmt(forecastTan)} mg N/L for today.`);
  if (far(r.no2MgN, forecastNo2, limitNo2)) out.push(`Nitrite ${fmt(r.no2MgN!)} mg N/L is far above the forecast of ${fmt(forecastNo2)} mg N/L for today.`);
  return out;
}

async function activePlanFindings(ds: DataSource, tank: Tank, reading: Reading, values: ReadingValues): Promise<string[]> {
  const plan = await ds.getRepository(Plan).findOneBy({ tankId: tank.id, status: 'active' });
  if (!plan) return [];
  const day = planDay(plan.startDate, reading.takenAt.toISOString().slice(0, 10));
  if (day < 0) return [];
  const scenario = scenarioFromPlan(tank, await ds.getRepository(Livestock).findBy({ tankId: tank.id }), plan);
  const result = forecastParsed(scenario, { horizonDays: Math.max(day + 1, 2) });
  const i = result.series.days.findIndex((d) => d >= day);
  if (i < 0) return [];
  const limits = defaultLimits({ ph: values.ph, temperatureC: values.temperatureC });
  return forecastFindings(values, result.series.tanMgN[i], result.series.no2MgN[i], limits.freeNh3AsTan.value, limits.nitrite.value);
}

/** Checks one logged reading and e-mails the tank's owner once (key `alert:<readingId>`). */
export async function checkReading({ dataSource: ds, mailer, config, logger }: JobDeps, readingId: string): Promise<boolean> {
  const reading = await ds.getRepository(Reading).findOneBy({ id: readingId });
  if (!reading) return false;
  const tank = await ds.getRepository(Tank).findOneByOrFail({ id: reading.tankId });
  const values: ReadingValues = { tanMgN: reading.tanMgN, no2MgN: reading.no2MgN, ph: reading.ph ?? tank.ph, temperatureC: reading.temperatureC ?? tank.temperatureC };
  let findings = limitFindings(values);
  try {
    findings = [...findings, ...(await activePlanFindings(ds, tank, reading, values))];
  } catch (err) {
    // A plan the engine refuses must not stop the limit alert.
    logger.log('warn', 'jobs.alert_forecast_failed', { readingId, error: String(err) });
  }
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
