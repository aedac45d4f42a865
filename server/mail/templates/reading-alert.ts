import { escapeHtml, type MailContent } from '../mailer.js';

export interface ReadingAlertMail {
  displayName: string;
  tankName: string;
  /** The line above the findings; by default the one for a single logged test. */
  intro?: string;
  /** One line per finding, e.g. "Nitrite 0.5 mg N/L is over the limit of 0.1 mg N/L". */
  findings: string[];
  tankLink: string;
}

/** An alert for a logged water test over a limit or far above its forecast. */
export function readingAlertMail(m: ReadingAlertMail): MailContent {
  const subject = `Water test alert for ${m.tankName}`;
  const intro = m.intro ?? `The water test you logged for ${m.tankName} needs attention:`;
  const text = [
    `Hello ${m.displayName},`,
    '',
    intro,
    ...m.findings.map((f) => `- ${f}`),
    '',
    'Test again to confirm. If it stays high, a partial water change with dechlorinated water of',
    'matching temperature lowers ammonia and nitrite at once; feed less until it settles. For',
    'fish that look unwell, ask a qualified aquatic veterinarian.',
    '',
    m.tankLink,
    '',
    '— Shoalshift',
  ].join('\n');
  const html = `<!doctype html>
<html lang="en"><body style="font-family: system-ui, sans-serif; line-height: 1.5; color: #12303a;">
<p>Hello ${escapeHtml(m.displayName)},</p>
<p>${escapeHtml(intro)}</p>
<ul>${m.findings.map((f) => `<li>${escapeHtml(f)}</li>`).join('')}</ul>
<p>Test again to confirm. If it stays high, a partial water change with dechlorinated water of matching temperature
lowers ammonia and nitrite at once; feed less until it settles. For fish that look unwell, ask a qualified aquatic veterinarian.</p>
<p><a href="${escapeHtml(m.tankLink)}">Open the tank</a></p>
<p>— Shoalshift</p>
</body></html>
`;
  return { subject, text, html };
}
