import { escapeHtml, type MailContent } from '../mailer.js';

export interface SignUpExistingAccountMail {
  displayName: string;
  signInLink: string;
  /** A single-use reset link, or the page that asks for one when the account had enough links this hour. */
  resetLink: string;
  /** How long the reset link works; null when `resetLink` is the page that asks for one. */
  resetValidMinutes: number | null;
}

/**
 * Sent instead of a sign-up link when the address already has an account: the sign-up page
 * answers the same either way, so only the mailbox's owner learns the account exists.
 */
export function signUpExistingAccountMail({ displayName, signInLink, resetLink, resetValidMinutes }: SignUpExistingAccountMail): MailContent {
  const resetWords =
    resetValidMinutes === null
      ? 'Forgot your password? Ask for a reset link here:'
      : `Forgot your password? This link sets a new one (it works once, within ${resetValidMinutes} minutes):`;
  const subject = 'You already have a Shoalshift account';
  const text = [
    `Hello ${displayName},`,
    '',
    'Someone (perhaps you) tried to create a Shoalshift account with this e-mail address.',
    'It already has an account, so nothing was changed. Sign in here:',
    '',
    signInLink,
    '',
    resetWords,
    '',
    resetLink,
    '',
    'If it was not you, ignore this e-mail: your account and password stay as they are.',
    '',
    '— Shoalshift',
  ].join('\n');
  const name = escapeHtml(displayName);
  const html = `<!doctype html>
<html lang="en"><body style="font-family: system-ui, sans-serif; line-height: 1.5; color: #12303a;">
<p>Hello ${name},</p>
<p>Someone (perhaps you) tried to create a Shoalshift account with this e-mail address.
It already has an account, so nothing was changed.</p>
<p><a href="${escapeHtml(signInLink)}">Sign in</a></p>
<p>${escapeHtml(resetWords)}<br><a href="${escapeHtml(resetLink)}">${resetValidMinutes === null ? 'Ask for a reset link' : 'Choose a new password'}</a></p>
<p>If it was not you, ignore this e-mail: your account and password stay as they are.</p>
<p>— Shoalshift</p>
</body></html>
`;
  return { subject, text, html };
}
