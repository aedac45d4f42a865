import { afterEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Reading } from '../../server/entities/reading.js';
import { ReminderOptOut } from '../../server/entities/reminder-opt-out.js';
import type { AppDeps } from '../../server/deps.js';
import {
  IMPORT_ALERT_MAX_LISTED,
  IMPORT_ALERT_RECENT_DAYS,
  IMPORT_CHECK_QUEUE,
  checkImportedReadings,
  limitFindings,
  onReadingLogged,
  type ImportCheckJob,
} from '../../server/jobs/alerts.js';
import { REMINDER_SCAN_QUEUE, checkDayOn, sendReminder, utcDate } from '../../server/jobs/reminders.js';
import { startJobs, type JobRunner } from '../../server/jobs/runner.js';
import { createMailer } from '../../server/mail/mailer.js';
import { GOOD_PASSWORD, createPlan, createReading, createTank, createUser } from './helpers/factories.js';
import { signedInKeeper } from './helpers/keeper-client.js';
import { client, sleep, useTestApp } from './helpers/test-app.js';

const ctx = useTestApp();
const runners: JobRunner[] = [];

afterEach(async () => {
  while (runners.length) await runners.pop()!.stop();
  await ctx.deps.dataSource.query(`DELETE FROM mail_sends`);
});

/** Two "server processes": each its own mailer and pg-boss instance (own pool, own workers), one database. */
async function twoWorkers(): Promise<[AppDeps, AppDeps]> {
  const a: AppDeps = { ...ctx.deps, mailer: createMailer(ctx.deps.config.smtp) };
  const b: AppDeps = { ...ctx.deps, mailer: createMailer(ctx.deps.config.smtp) };
  for (const d of [a, b]) {
    const runner = await startJobs(d, { schedule: false, pollingIntervalSeconds: 0.5 });
    runners.push(runner);
    d.jobs = runner;
  }
  await ctx.deps.dataSource.query(`DELETE FROM pgboss.job`);
  return [a, b];
}

/** Jobs that threw (pg-boss keeps them for retry): none may. */
const failedJobs = async () =>
  (await ctx.deps.dataSource.query(`SELECT name, output->>'message' AS message FROM pgboss.job WHERE state IN ('retry', 'failed')`)) as unknown[];

const DAY_MS = 86_400_000;
const isoDaysAgo = (n: number) => new Date(Date.now() - n * DAY_MS).toISOString().slice(0, 10);

async function keeperWithActivePlan(startDaysAgo: number) {
  const ds = ctx.deps.dataSource;
  const user = await createUser(ds, { email: 'rosa@example.org', displayName: 'Rosa' });
  const tank = await createTank(ds, user.id, { name: 'Hallway 120 L' });
  const plan = await createPlan(ds, tank.id, {
    name: 'Twelve rasboras',
    status: 'active',
    startDate: isoDaysAgo(startDaysAgo),
    events: [{ type: 'add-fish', day: 0, fish: [{ species: 'harlequin-rasbora', count: 12 }] }],
  });
  return { user, tank, plan };
}

/** Waits until `count()` stays at its value for `quietMs` after first reaching `atLeast`. */
async function settle(count: () => number, atLeast: number, quietMs = 2500, timeoutMs = 20_000): Promise<number> {
  const deadline = Date.now() + timeoutMs;
  while (count() < atLeast && Date.now() < deadline) await sleep(50);
  await sleep(quietMs);
  return count();
}

describe("check days (the plans' rule in shared/plan-check-days.ts, common practice)", () => {
  it('finds the plan day and its reason for a calendar date, and nothing on other days', () => {
    const events = [{ type: 'add-fish' as const, day: 0, fish: [{ species: 'platy', count: 5 }] }];
    expect(checkDayOn(events, '2026-03-01', '2026-03-03')).toEqual({ day: 2, reason: '5 fish added on day 0' });
    // Days 1, 2, 3, 5, … after a new load: day 4 is not one.
    expect(checkDayOn(events, '2026-03-01', '2026-03-05')).toBeNull();
  });
});

describe('test-day reminders with two server processes on one database', () => {
  it('a due reminder produces exactly one e-mail when both processes run the scan', async () => {
    const { plan } = await keeperWithActivePlan(2);
    const [a, b] = await twoWorkers();
    // Each process's daily cron fires the scan for today.
    const today = utcDate();
    await Promise.all([a.jobs!.send(REMINDER_SCAN_QUEUE, { date: today }), b.jobs!.send(REMINDER_SCAN_QUEUE, { date: today })]);
    const reminders = () => ctx.mail.messages().filter((m) => m.subject.startsWith('Test day for'));
    expect(await settle(() => reminders().length, 1)).toBe(1);
    const mail = reminders()[0];
    expect(mail.to).toEqual(['rosa@example.org']);
    expect(mail.subject).toBe('Test day for Hallway 120 L: day 2 of "Twelve rasboras"');
    expect(mail.text).toContain('12 fish added on day 0');
    expect(mail.html).toContain('Stop test-day reminders');
    const sent = await ctx.deps.dataSource.query(`SELECT key FROM mail_sends`);
    expect(sent).toEqual([{ key: `reminder:${plan.id}:${today}` }]);
    expect(await failedJobs()).toEqual([]);
  });

  it('a retried or doubled send job never sends twice (unique key), and no mail on a non-test day', async () => {
    const { plan } = await keeperWithActivePlan(2);
    const b: AppDeps = { ...ctx.deps, mailer: createMailer(ctx.deps.config.smtp) };
    const job = { planId: plan.id, date: utcDate() };
    const results = await Promise.all([sendReminder(ctx.deps, job), sendReminder(b, job), sendReminder(ctx.deps, job)]);
    expect(results.filter(Boolean)).toHaveLength(1);
    expect(ctx.mail.messages()).toHaveLength(1);
    // Day 4 is not a test day under the rule (days 1, 2, 3, 5, …).
    expect(await sendReminder(ctx.deps, { planId: plan.id, date: isoDaysAgo(-2) })).toBe(false);
    b.mailer.close();
  });

  it('the unsubscribe link works without signing in and stops later reminders', async () => {
    const { plan, user } = await keeperWithActivePlan(3);
    await sendReminder(ctx.deps, { planId: plan.id, date: utcDate() });
    const link = /https?:\/\/\S+\/api\/unsubscribe\/(\S+)/.exec(ctx.mail.messages()[0].text);
    expect(link).not.toBeNull();
    const path = `/api/unsubscribe/${link![1]}`;
    // GET only shows the confirmation (mail scanners prefetch links); POST unsubscribes.
    const page = await request(ctx.app).get(path).expect(200);
    expect(page.text).toContain('<form method="post">');
    expect(await ctx.deps.dataSource.getRepository(ReminderOptOut).count()).toBe(0);
    await request(ctx.app).post(path).type('form').send('').expect(200);
    expect(await ctx.deps.dataSource.getRepository(ReminderOptOut).findOneBy({ userId: user.id })).not.toBeNull();
    await request(ctx.app).post(`/api/unsubscribe/${link![1].slice(0, -3)}abc`).expect(404);
    // Day 5 is a test day, but the keeper opted out.
    expect(await sendReminder(ctx.deps, { planId: plan.id, date: isoDaysAgo(-2) })).toBe(false);
    expect(ctx.mail.messages()).toHaveLength(1);
  });
});

describe('alerts for logged readings', () => {
  it('an over-limit reading produces one alert, even when logged twice to the queue; a normal one none', async () => {
    const ds = ctx.deps.dataSource;
    const user = await createUser(ds, { email: 'ines@example.org', displayName: 'Ines' });
    const tank = await createTank(ds, user.id, { name: 'Office nano' });
    const [a, b] = await twoWorkers();
    // 0.5 mg NO2-N/L is over the 0.1 mg N/L culture-practice limit (Boyd, via simulation/limits.ts).
    const high = await createReading(ds, tank.id, { tanMgN: 0.1, no2MgN: 0.5, ph: 7.2, temperatureC: 25 });
    const fine = await createReading(ds, tank.id, { tanMgN: 0.05, no2MgN: 0, ph: 7.2, temperatureC: 25 });
    await Promise.all([onReadingLogged(a, high), onReadingLogged(b, high), onReadingLogged(a, fine)]);
    const alerts = () => ctx.mail.messages().filter((m) => m.subject.startsWith('Water test alert'));
    expect(await settle(() => alerts().length, 1)).toBe(1);
    expect(alerts()[0].text).toMatch(/Nitrite 0\.5 mg N\/L is over the limit of 0\.1 mg N\/L/);
    expect(alerts()[0].text).toContain('qualified aquatic veterinarian');
    expect(await ds.query(`SELECT key FROM mail_sends`)).toEqual([{ key: `alert:${high.id}` }]);
    expect(await failedJobs()).toEqual([]);
    expect(await ds.getRepository(Reading).count()).toBe(2);
  });

  it('logging an over-limit test through the API sends the owner one alert (the readings route enqueues the check)', async () => {
    const ds = ctx.deps.dataSource;
    const user = await createUser(ds, { email: 'omar@example.org', displayName: 'Omar' });
    const tank = await createTank(ds, user.id, { name: 'Study 40 L' });
    const [a] = await twoWorkers();
    ctx.deps.jobs = a.jobs;
    try {
      const c = client(ctx.app);
      await c.post('/api/auth/sign-in', { email: 'omar@example.org', password: GOOD_PASSWORD }).expect(200);
      // 1.0 mg/L nitrite "as the ion" = 0.30 mg N/L (14.007/46.005), over the 0.1 mg N/L limit (Boyd).
      await c.post(`/api/tanks/${tank.id}/readings`, { takenAt: new Date().toISOString(), basis: 'ion', no2: 1, ph: 7.2, temperatureC: 25 }).expect(201);
      const alerts = () => ctx.mail.messages().filter((m) => m.subject === 'Water test alert for Study 40 L');
      expect(await settle(() => alerts().length, 1)).toBe(1);
      expect(alerts()[0].text).toMatch(/Nitrite 0\.3 mg N\/L is over the limit/);
    } finally {
      ctx.deps.jobs = undefined;
    }
  });

  it('a failed enqueue never fails the caller (the reading is saved already); it is logged', async () => {
    const jobs = { send: async () => Promise.reject(new Error('queue down')) };
    await expect(onReadingLogged({ jobs, logger: ctx.logs }, { id: '00000000-0000-4000-8000-000000000001' })).resolves.toBeUndefined();
    expect(ctx.logs.entries.some((e) => e.event === 'jobs.enqueue_failed')).toBe(true);
  });

  it('free ammonia is judged at the reading’s pH and temperature', () => {
    // 1 mg TAN-N/L at pH 8.2, 28 °C: free fraction ≈ 10 % (Emerson et al. 1975: pKa = 0.09018 +
    // 2729.92/T), i.e. ≈ 0.12 mg NH3/L, over the CCME 0.019 mg NH3/L guideline; at pH 6.5 ≈ 0.003.
    expect(limitFindings({ tanMgN: 1, no2MgN: 0, ph: 8.2, temperatureC: 28 })[0]).toMatch(/Free ammonia 0\.12 mg NH3\/L/);
    expect(limitFindings({ tanMgN: 1, no2MgN: 0, ph: 6.5, temperatureC: 28 })).toEqual([]);
  });
});

describe('alerts for imported readings (one e-mail per import at most)', () => {
  const HEADER = 'taken_at,basis,total_ammonia,nitrite,nitrate,ph,temperature_c,kh_dkh,note';
  const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000);
  const row = (at: Date, no2: number, tan = 0.1) => `${at.toISOString()},N,${tan},${no2},10,7.2,25,4,`;
  /** How the alert names a test's time. */
  const utcMinute = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
  const alertsFor = (tankName: string) => () => ctx.mail.messages().filter((m) => m.subject === `Water test alert for ${tankName}`);
  const importJobs = async () =>
    ((await ctx.deps.dataSource.query(`SELECT data FROM pgboss.job WHERE name = $1`, [IMPORT_CHECK_QUEUE])) as { data: ImportCheckJob }[]).map((r) => r.data);

  async function importer(tankName: string) {
    const keeper = await signedInKeeper(ctx, 'jun@example.org');
    const tank = await createTank(ctx.deps.dataSource, keeper.user.id, { name: tankName });
    return { keeper, tank, commit: (rows: string[]) => keeper.upload(`/api/tanks/${tank.id}/readings/import/commit`, [HEADER, ...rows].join('\n')) };
  }

  it('one recent over-limit nitrite among normal rows → exactly one alert naming it; an old high row is left out; re-running the job sends nothing more', async () => {
    const { tank, commit } = await importer('Landing 60 L');
    const [a, b] = await twoWorkers();
    ctx.deps.jobs = a.jobs;
    try {
      const high = hoursAgo(20);
      // 0.5 mg NO2-N/L is over the 0.1 mg N/L culture-practice limit (Boyd, via simulation/limits.ts);
      // 0.8 is too, but 30 days old: history, not an alarm. The rest are normal (0 nitrite, 0.1 TAN at pH 7.2).
      await commit([row(hoursAgo(24 * 30), 0.8), row(hoursAgo(72), 0), row(hoursAgo(48), 0), row(high, 0.5), row(hoursAgo(2), 0)]).expect(201);
      const alerts = alertsFor('Landing 60 L');
      expect(await settle(() => alerts().length, 1)).toBe(1);
      const text = alerts()[0].text;
      expect(text).toContain('Of the water tests you imported for Landing 60 L');
      expect(text).toContain(`Test of ${utcMinute(high)}: Nitrite 0.5 mg N/L is over the limit of 0.1 mg N/L.`);
      expect(text).not.toContain('0.80');
      expect(text.match(/^- /gm)).toHaveLength(1);

      // One job for the import, carrying only its four recent tests.
      const jobs = await importJobs();
      expect(jobs).toHaveLength(1);
      expect(jobs[0]).toMatchObject({ tankId: tank.id });
      expect(jobs[0].readingIds).toHaveLength(4);
      const sent: { key: string }[] = await ctx.deps.dataSource.query(`SELECT key FROM mail_sends`);
      expect(sent).toEqual([{ key: `alert:import:${jobs[0].importId}` }]);
      // A retried or doubled job (any process) finds the key taken.
      expect(await Promise.all([checkImportedReadings(a, jobs[0]), checkImportedReadings(b, jobs[0])])).toEqual([false, false]);
      expect(alerts()).toHaveLength(1);
      expect(await failedJobs()).toEqual([]);
    } finally {
      ctx.deps.jobs = undefined;
    }
  });

  it(`an import of only old over-limit rows (over ${IMPORT_ALERT_RECENT_DAYS} days) queues no check and sends nothing`, async () => {
    const { commit } = await importer('Shelf 25 L');
    const [a] = await twoWorkers();
    ctx.deps.jobs = a.jobs;
    try {
      // Nitrite 0.6 and 1.2 mg N/L, both over the 0.1 mg N/L limit (Boyd), taken 8 and 40 days ago.
      await commit([row(hoursAgo(24 * 40), 1.2), row(hoursAgo(24 * 8), 0.6)]).expect(201);
      expect(await settle(() => alertsFor('Shelf 25 L')().length, 0)).toBe(0);
      expect(await importJobs()).toEqual([]);
      expect(await ctx.deps.dataSource.query(`SELECT key FROM mail_sends`)).toEqual([]);
    } finally {
      ctx.deps.jobs = undefined;
    }
  });

  it(`many alarming tests in one import → one e-mail listing the ${IMPORT_ALERT_MAX_LISTED} most recent and counting the rest`, async () => {
    const ds = ctx.deps.dataSource;
    const user = await createUser(ds, { email: 'lin@example.org', displayName: 'Lin' });
    const tank = await createTank(ds, user.id, { name: 'Kitchen 90 L' });
    // Nitrite 0.2–0.6 mg N/L, each over the 0.1 mg N/L limit (Boyd, via simulation/limits.ts).
    const readings = [];
    for (let i = 0; i < 5; i++) readings.push(await createReading(ds, tank.id, { takenAt: hoursAgo(10 + 24 * i), no2MgN: 0.2 + 0.1 * i, tanMgN: 0.1, ph: 7.2, temperatureC: 25 }));
    readings.push(await createReading(ds, tank.id, { takenAt: hoursAgo(1), no2MgN: 0, tanMgN: 0.1, ph: 7.2, temperatureC: 25 }));
    const job: ImportCheckJob = { tankId: tank.id, readingIds: readings.map((r) => r.id), importId: '00000000-0000-4000-8000-0000000000aa' };
    expect(await checkImportedReadings(ctx.deps, job)).toBe(true);
    expect(await checkImportedReadings(ctx.deps, job)).toBe(false);
    const mails = alertsFor('Kitchen 90 L')();
    expect(mails).toHaveLength(1);
    const lines = mails[0].text.split('\n').filter((l) => l.startsWith('- '));
    expect(lines).toEqual([
      `- Test of ${utcMinute(readings[0].takenAt)}: Nitrite 0.2 mg N/L is over the limit of 0.1 mg N/L.`,
      `- Test of ${utcMinute(readings[1].takenAt)}: Nitrite 0.3 mg N/L is over the limit of 0.1 mg N/L.`,
      `- Test of ${utcMinute(readings[2].takenAt)}: Nitrite 0.4 mg N/L is over the limit of 0.1 mg N/L.`,
      `- 2 earlier imported tests from the last ${IMPORT_ALERT_RECENT_DAYS} days also need attention.`,
    ]);
    // A job for another tank's readings finds none of them.
    expect(await checkImportedReadings(ctx.deps, { ...job, tankId: '00000000-0000-4000-8000-0000000000bb', importId: '00000000-0000-4000-8000-0000000000cc' })).toBe(false);
  });
});
