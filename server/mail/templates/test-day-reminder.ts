import { escapeHtml, type MailContent } from '../mailer.js';

export interface TestDayReminderMail {
  displayName: string;
  tankName: string;
  planName: string;
  /** Plan day number (day 0 = the plan's start). */
  planDay: number;
  /** Why today is a test day, e.g. "12 fish added on day 0" (shared/plan-check-days.ts). */
  reason: string;
  tankLink: string;
  unsubscribeLink: string;
}

/** A test-day reminder for an active plan, with an unsubscribe link that needs no sign-in. */
export function testDayReminderMail(m: TestDayReminderMail): MailContent {
  const subject = `Test day for ${m.tankName}: day ${m.planDay} of "${m.planName}"`;
  const text = [
    `Hello ${m.displayName},`,
    '',
    `Today is day ${m.planDay} of your plan "${m.planName}" for ${m.tankName} (${m.reason}).`,
    'Test total ammonia and nitrite, and log the results so the forecast can be checked:',
    '',
    m.tankLink,
    '',
    'The forecast is an estimate: your water tests decide. If ammonia or nitrite are high, a',
    'water change with dechlorinated water of matching temperature brings them down.',
    '',
    `To stop test-day reminders: ${m.unsubscribeLink}`,
    '',
    '— Shoalshift',
  ].join('\n');
  const html = `<!doctype html>
<html lang="en"><body style="font-family: system-ui, sans-serif; line-height: 1.5; color: #12303a;">
<p>Hello ${escapeHtml(m.displayName)},</p>
<p>Today is day ${m.planDay} of your plan “${escapeHtml(m.planName)}” for ${escapeHtml(m.tankName)} (${escapeHtml(m.reason)}).
Test total ammonia and nitrite, and log the results so the forecast can be checked:</p>
<p><a href="${escapeHtml(m.tankLink)}">Log a water test</a></p>
<p>The forecast is an estimate: your water tests decide. If ammonia or nitrite are high, a water change with
dechlorinated water of matching temperature brings them down.</p>
<p style="font-size: 0.9em;"><a href="${escapeHtml(m.unsubscribeLink)}">Stop test-day reminders</a></p>
<p>— Shoalshift</p>
</body></html>
`;
  return { subject, text, html };
}
