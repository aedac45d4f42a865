import type { MailContent } from '../mailer.js';
import { linkMail } from './link-mail.js';

export interface SignUpConfirmMail {
  displayName: string;
  link: string;
  validHours: number;
}

/** The link that finishes a sign-up for an address without an account. */
export function signUpConfirmMail({ displayName, link, validHours }: SignUpConfirmMail): MailContent {
  return linkMail({
    subject: 'Finish creating your Shoalshift account',
    displayName,
    why: 'Someone (we hope you) started a Shoalshift account with this e-mail address.',
    when: `Open this link within ${validHours} hours to finish. It works once:`,
    linkLabel: 'Finish creating my account',
    link,
    notYou: 'If it was not you, ignore this e-mail: no account is made without the link.',
  });
}
