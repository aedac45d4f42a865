import { describe, expect, it } from 'vitest';
import { PASSWORD_MIN_LENGTH } from '../../shared/schemas/auth.js';
import { commonPasswords, isCommonPassword } from '../../server/security/common-passwords.js';

describe('the common-password list (ASVS 6.2.4: at least the top 3,000)', () => {
  it('holds well over 3,000 entries, of which over 3,000 are long enough to be chosen here', () => {
    const list = [...commonPasswords()];
    expect(list.length).toBeGreaterThanOrEqual(3000);
    expect(list.filter((p) => p.length >= PASSWORD_MIN_LENGTH).length).toBeGreaterThanOrEqual(3000);
  });

  it('refuses listed passwords far down the list, whatever their case, and the product name', () => {
    const choosable = [...commonPasswords()].filter((p) => p.length >= PASSWORD_MIN_LENGTH);
    for (const p of [choosable[0], choosable[2999], choosable[choosable.length - 1]]) {
      expect(isCommonPassword(p), p).toBe(true);
      expect(isCommonPassword(p.toUpperCase()), p).toBe(true);
    }
    expect(isCommonPassword('Shoalshift123')).toBe(true);
  });

  it('refuses the e-mail or its name part, and lets a passphrase through', () => {
    expect(isCommonPassword('reed.keeper', 'reed.keeper@example.org')).toBe(true);
    expect(isCommonPassword('tidal-pebble-heron-90', 'reed.keeper@example.org')).toBe(false);
  });
});
