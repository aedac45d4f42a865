import { escapeHtml, type MailContent } from '../mailer.js';

export interface ClubInviteMail {
  clubName: string;
  invitedBy: string;
  link: string;
  validDays: number;
}

/**
 * The club invitation: who invites, to which club, the single-use link and its lifetime.
 * The subject is fixed wording: names typed by whoever made the club never reach the line an
 * inbox shows, so an invite cannot be dressed up as another message. The body names the club
 * and the organizer, quoted, because the recipient needs them to recognise a genuine invite;
 * there is no free-form message at all, and sending is capped (services/invite-quota.ts).
 */
export const CLUB_INVITE_SUBJECT = 'An invitation to a club on Shoalshift';

export function clubInviteMail({ clubName, invitedBy, link, validDays }: ClubInviteMail): MailContent {
  const subject = CLUB_INVITE_SUBJECT;
  const text = [
    'Hello,',
    '',
    `"${invitedBy}" invites you to join the club "${clubName}" on Shoalshift, where club members`,
    'plan stocking changes, share their tanks with mentors and learn from lessons.',
    '',
    `Open this link within ${validDays} days to join. It works once:`,
    '',
    link,
    '',
    'If you do not know this club, ignore this e-mail: nothing happens unless you open the link.',
    '',
    '— Shoalshift',
  ].join('\n');
  const href = escapeHtml(link);
  const html = `<!doctype html>
<html lang="en"><body style="font-family: system-ui, sans-serif; line-height: 1.5; color: #12303a;">
<p>Hello,</p>
<p>&ldquo;${escapeHtml(invitedBy)}&rdquo; invites you to join the club <strong>${escapeHtml(clubName)}</strong> on Shoalshift, where club members
plan stocking changes, share their tanks with mentors and learn from lessons.</p>
<p>Open this link within ${validDays} days to join. It works once:</p>
<p><a href="${href}">Join ${escapeHtml(clubName)}</a></p>
<p style="font-size: 0.9em;">Or paste this address into your browser:<br>${href}</p>
<p>If you do not know this club, ignore this e-mail: nothing happens unless you open the link.</p>
<p>— Shoalshift</p>
</body></html>
`;
  return { subject, text, html };
}
