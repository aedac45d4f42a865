import { escapeHtml, type MailContent } from '../mailer.js';

/** A single-use link e-mail (password reset, finishing a sign-up): one layout, its own words. */
export interface LinkMail {
  subject: string;
  displayName: string;
  /** Why the mail came, ending in how long the link works (plain text, one sentence each). */
  why: string;
  when: string;
  /** The button text of the HTML part. */
  linkLabel: string;
  link: string;
  /** What to do if the keeper did not ask for it. */
  notYou: string;
}

export function linkMail({ subject, displayName, why, when, linkLabel, link, notYou }: LinkMail): MailContent {
  const text = [`Hello ${displayName},`, '', why, when, '', link, '', notYou, '', '— Shoalshift'].join('\n');
  const name = escapeHtml(displayName);
  const href = escapeHtml(link);
  const html = `<!doctype html>
<html lang="en"><body style="font-family: system-ui, sans-serif; line-height: 1.5; color: #12303a;">
<p>Hello ${name},</p>
<p>${escapeHtml(why)}
${escapeHtml(when)}</p>
<p><a href="${href}">${escapeHtml(linkLabel)}</a></p>
<p style="font-size: 0.9em;">Or paste this address into your browser:<br>${href}</p>
<p>${escapeHtml(notYou)}</p>
<p>— Shoalshift</p>
</body></html>
`;
  return { subject, text, html };
}
