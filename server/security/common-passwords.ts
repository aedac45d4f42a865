/**
 * Passwords of 8 characters or more that top the public breach-frequency lists (from memory of
 * the widely published "most common passwords" tables). Short on purpose: it catches the
 * guesses an attacker tries first (ASVS 6.2.4); length and the sign-in limit do the rest.
 * Compared lower-cased.
 */
export const COMMON_PASSWORDS: ReadonlySet<string> = new Set([
  '12345678', '123456789', '1234567890', '12345678910', '0123456789', '87654321', '987654321',
  '11111111', '00000000', '88888888', '99999999', '66666666', '12121212', '11223344', '12344321',
  '123123123', '123321123', '147258369', '159753258', '1q2w3e4r', '1q2w3e4r5t', '1q2w3e4r5t6y',
  'q1w2e3r4', 'q1w2e3r4t5', 'zaq12wsx', '1qaz2wsx', '1qazxsw2', 'qazwsxedc', 'qwerty123',
  'qwerty12', 'qwertyui', 'qwertyuiop', 'asdfghjkl', 'asdfasdf', 'zxcvbnm1', 'zxcvbnm123',
  'password', 'password1', 'password12', 'password123', 'password!', 'passw0rd', 'p@ssw0rd',
  'p@ssword', 'pa$$word', 'mypassword', 'newpassword', 'changeme', 'changeme1', 'letmein1',
  'letmein123', 'welcome1', 'welcome123', 'iloveyou', 'iloveyou1', 'iloveyou2', 'trustno1',
  'sunshine', 'sunshine1', 'princess', 'princess1', 'football', 'football1', 'baseball',
  'basketball', 'superman', 'batman123', 'starwars', 'whatever', 'computer', 'internet',
  'michelle', 'jennifer', 'jordan23', 'charlie1', 'master123', 'mustang1', 'shadow123',
  'dragon123', 'monkey123', 'abcd1234', 'abc12345', 'abcdefgh', 'abcdef123', 'aa123456',
  'a1234567', 'a12345678', 'qwer1234', 'asdf1234', 'admin123', 'administrator', 'root1234',
  'test1234', 'testtest', 'guest123', 'default1', 'secret123', 'freedom1', 'hello123',
  'helloworld', 'lovely123', 'loveme123', 'flower123', 'summer2024', 'summer2025', 'winter2024',
  'spring2025', 'autumn2025', 'qwerty2024', 'welcome2024', 'password2024', 'password2025',
  'password2026', 'aaaaaaaa', 'zzzzzzzz', 'asdfghjk', 'qweasdzxc', 'q1w2e3r4t5y6', '1password',
  'google123', 'samsung1', 'pokemon1', 'liverpool', 'chelsea1', 'arsenal1', 'manchester',
  'blink182', 'nirvana1', 'metallica', 'corvette', 'ferrari1', 'mercedes', 'hunter22',
  'killer123', 'hockey12', 'soccer12', 'tigger12', 'cookie123', 'chocolate', 'butterfly',
  'elephant', 'sparrow1', 'dolphins', 'goldfish', 'aquarium', 'aquarium1', 'fishtank',
  'fishtank1', 'shoalshift', 'shoalshift1', 'shoalshift123',
]);

/** True when the password is on the list (case-insensitive) or equals the e-mail or its name part. */
export function isCommonPassword(password: string, email?: string): boolean {
  const p = password.trim().toLowerCase();
  if (COMMON_PASSWORDS.has(p)) return true;
  if (email) {
    const e = email.toLowerCase();
    if (p === e || p === e.split('@')[0]) return true;
  }
  return false;
}

export const COMMON_PASSWORD_MESSAGE = 'This password is too easy to guess: it is on a list of common passwords. Choose another.';
