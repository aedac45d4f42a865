/**
 * The common-password check (ASVS 6.2.4 asks for at least the top 3,000): the 49,000-odd
 * passwords of `@zxcvbn-ts/language-common` (MIT; drawn from public breach-frequency lists and
 * maintained with zxcvbn-ts), plus a few words this product invites. Server only: the list is
 * about 0.5 MB, so it is loaded on the first check, never at boot and never in the web bundle.
 * Compared lower-cased.
 */

/** Context-specific words (ASVS 6.2.11): the product's name and what it is about. */
const CONTEXT_WORDS = ['shoalshift', 'shoalshift1', 'shoalshift123', 'aquarium', 'aquarium1', 'fishtank', 'fishtank1'];

let list: ReadonlySet<string> | undefined;

/** The whole list, loaded on first use. */
export function commonPasswords(): ReadonlySet<string> {
  if (!list) {
    // A require inside the function keeps the ~0.1 s decompression off boot and off every import.
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    const { dictionary } = require('@zxcvbn-ts/language-common') as typeof import('@zxcvbn-ts/language-common');
    list = new Set([...dictionary['passwords-common'], ...CONTEXT_WORDS].map((p) => p.toLowerCase()));
  }
  return list;
}

/** True when the password is on the list (case-insensitive) or equals the e-mail or its name part. */
export function isCommonPassword(password: string, email?: string): boolean {
  const p = password.trim().toLowerCase();
  if (commonPasswords().has(p)) return true;
  if (email) {
    const e = email.toLowerCase();
    if (p === e || p === e.split('@')[0]) return true;
  }
  return false;
}

export const COMMON_PASSWORD_MESSAGE = 'This password is too easy to guess: it is on a list of common passwords. Choose another.';
