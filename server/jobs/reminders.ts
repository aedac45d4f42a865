import type { DataSource } from 'typeorm';
import type { Config } from '../config.js';
import type { Logger } from '../logger.js';
import type { Mailer } from '../mail/mailer.js';
import { testDayReminderMail } from '../mail/templates/test-day-reminder.js';
import { signPayload } from '../services/secret-tokens.js';
import { planCheckDays } from '../../shared/plan-check-days.js';
import type { ScenarioEvent } from '../../simulation/scenario.js';
import { sendOnce } from './send-once.js';

export const REMINDER_SCAN_QUEUE = 'reminders-scan';
export const REMINDER_SEND_QUEUE = 'reminder-send';
/** Purpose string of the signed unsubscribe token. */
export const UNSUBSCRIBE_PURPOSE = 'unsubscribe-reminders';

export interface ReminderJob {
  planId: string;
  /** Calendar date (YYYY-MM-DD, UTC) the reminder is for. */
  date: string;
}

export interface JobDeps {
  dataSource: DataSource;
  mailer: Mailer;
  config: Config;
  logger: Logger;
}

/** Whole days from `startDate` to `date` (both YYYY-MM-DD, UTC calendar days). */
export function planDay(startDate: string, date: string): number {
  return Math.round((Date.parse(`${date}T00:00:00Z`) - Date.parse(`${startDate}T00:00:00Z`)) / 86_400_000);
}

/**
 * The plan's check day on `date`, by the plans' own rule (shared/plan-check-days.ts: daily for
 * the first days after a new load, then spaced out to two weeks; common practice), or null.
 */
export function checkDayOn(events: readonly ScenarioEvent[], startDate: string, date: string): { day: number; reason: string } | null {
  const found = planCheckDays(events, startDate).find((c) => c.date === date);
  return found ? { day: found.day, reason: found.reasons.join('; ') } : null;
}

/** Today's UTC calendar date. */
export const utcDate = (now = new Date()) => now.toISOString().slice(0, 10);

/** Active plans whose check days include `date`: one reminder job each. */
export async function dueReminders(ds: DataSource, date: string): Promise<ReminderJob[]> {
  const plans: { id: string; start_date: string; events: ScenarioEvent[] }[] = await ds.query(
    `SELECT p.id, to_char(p.start_date, 'YYYY-MM-DD') AS start_date, p.events
       FROM plans p JOIN tanks t ON t.id = p.tank_id
      WHERE p.status = 'active' AND p.start_date <= $1::date
        AND NOT EXISTS (SELECT 1 FROM reminder_opt_outs o WHERE o.user_id = t.owner_id)`,
    [date],
  );
  return plans.filter((p) => checkDayOn(p.events, p.start_date, date) !== null).map((p) => ({ planId: p.id, date }));
}

export function unsubscribeLink(config: Config, userId: string): string {
  return `${config.appUrl}/api/unsubscribe/${encodeURIComponent(signPayload(config.unsubscribeSecret, UNSUBSCRIBE_PURPOSE, userId))}`;
}

/** Sends one reminder unless it was sent already, the plan is no longer active, or the keeper opted out. */
export async function sendReminder({ dataSource: ds, mailer, config, logger }: JobDeps, job: ReminderJob): Promise<boolean> {
  const rows: { plan_name: string; start_date: string; events: ScenarioEvent[]; status: string; tank_id: string; tank_name: string; user_id: string; email: string; display_name: string; opted_out: boolean }[] =
    await ds.query(
      `SELECT p.name AS plan_name, to_char(p.start_date, 'YYYY-MM-DD') AS start_date, p.events, p.status, t.id AS tank_id, t.name AS tank_name,
              u.id AS user_id, u.email, u.display_name,
              EXISTS (SELECT 1 FROM reminder_opt_outs o WHERE o.user_id = u.id) AS opted_out
         FROM plans p JOIN tanks t ON t.id = p.tank_id JOIN users u ON u.id = t.owner_id WHERE p.id = $1`,
      [job.planId],
    );
  const r = rows[0];
  if (!r || r.status !== 'active' || r.opted_out) return false;
  const check = checkDayOn(r.events, r.start_date, job.date);
  if (!check) return false;
  const content = testDayReminderMail({
    displayName: r.display_name,
    tankName: r.tank_name,
    planName: r.plan_name,
    planDay: check.day,
    reason: check.reason,
    tankLink: `${config.appUrl}/tanks/${r.tank_id}`,
    unsubscribeLink: unsubscribeLink(config, r.user_id),
  });
  const sent = await sendOnce(ds, mailer, `reminder:${job.planId}:${job.date}`, r.user_id, r.email, content);
  logger.log('info', sent ? 'jobs.reminder_sent' : 'jobs.reminder_already_sent', { planId: job.planId, date: job.date });
  return sent;
}
