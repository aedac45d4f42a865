import type { MailContent } from '../mailer.js';
import { linkMail } from './link-mail.js';

export interface PasswordResetMail {
  displayName: string;
  link: string;
  validMinutes: number;
}

/** The password reset e-mail: the single-use link and what to do if it was not you. */
export function passwordResetMail({ displayName, link, validMinutes }: PasswordResetMail): MailContent {
  return linkMail({
    subject: 'Reset your Shoalshift password',
    displayName,
    why: 'Someone (we hope you) asked to reset the password of your Shoalshift account.',
    when: `Open this link within ${validMinutes} minutes to choose a new password. It works once:`,
    linkLabel: 'Choose a new password',
    link,
    notYou: 'If you did not ask for this, ignore this e-mail: your password stays as it is.',
  });
}
