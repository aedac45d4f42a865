import { escapeHtml, type MailContent } from '../mailer.js';

export interface PasswordResetMail {
  displayName: string;
  link: string;
  validMinutes: number;
}

/** The password reset e-mail: the single-use link and what to do if it was not you. */
export function passwordResetMail({ displayName, link, validMinutes }: PasswordResetMail): MailContent {
  const subject = 'Reset your Shoalshift password';
  const text = [
    `Hello ${displayName},`,
    '',
    'Someone (we hope you) asked to reset the password of your Shoalshift account.',
    `Open this link within ${validMinutes} minutes to choose a new password. It works once:`,
    '',
    link,
    '',
    'If you did not ask for this, ignore this e-mail: your password stays as it is.',
    '',
    '— Shoalshift',
  ].join('\n');
  const name = escapeHtml(displayName);
  const href = escapeHtml(link);
  const html = `<!doctype html>
<html lang="en"><body style="font-family: system-ui, sans-serif; line-height: 1.5; color: #12303a;">
<p>Hello ${name},</p>
<p>Someone (we hope you) asked to reset the password of your Shoalshift account.
Open this link within ${validMinutes} minutes to choose a new password. It works once:</p>
<p><a href="${href}">Choose a new password</a></p>
<p style="font-size: 0.9em;">Or paste this address into your browser:<br>${href}</p>
<p>If you did not ask for this, ignore this e-mail: your password stays as it is.</p>
<p>— Shoalshift</p>
</body></html>
`;
  return { subject, text, html };
}
