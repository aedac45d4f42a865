import { escapeHtml, type MailContent } from '../mailer.js';

export interface SignUpConfirmMail {
  displayName: string;
  link: string;
  validHours: number;
}

/** The link that finishes a sign-up for an address without an account. */
export function signUpConfirmMail({ displayName, link, validHours }: SignUpConfirmMail): MailContent {
  const subject = 'Finish creating your Shoalshift account';
  const text = [
    `Hello ${displayName},`,
    '',
    'Someone (we hope you) started a Shoalshift account with this e-mail address.',
    `Open this link within ${validHours} hours to finish. It works once:`,
    '',
    link,
    '',
    'If it was not you, ignore this e-mail: no account is made without the link.',
    '',
    '— Shoalshift',
  ].join('\n');
  const name = escapeHtml(displayName);
  const href = escapeHtml(link);
  const html = `<!doctype html>
<html lang="en"><body style="font-family: system-ui, sans-serif; line-height: 1.5; color: #12303a;">
<p>Hello ${name},</p>
<p>Someone (we hope you) started a Shoalshift account with this e-mail address.
Open this link within ${validHours} hours to finish. It works once:</p>
<p><a href="${href}">Finish creating my account</a></p>
<p style="font-size: 0.9em;">Or paste this address into your browser:<br>${href}</p>
<p>If it was not you, ignore this e-mail: no account is made without the link.</p>
<p>— Shoalshift</p>
</body></html>
`;
  return { subject, text, html };
}
