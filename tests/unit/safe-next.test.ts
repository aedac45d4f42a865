import { describe, expect, it } from 'vitest';
import { safeNextPath, signInHref } from '@/lib/safe-next';

describe('safeNextPath', () => {
  it('keeps a same-site path with its query', () => {
    expect(safeNextPath('/tanks/5f0c?tab=readings')).toBe('/tanks/5f0c?tab=readings');
  });

  it('takes the first value when the router hands over an array', () => {
    expect(safeNextPath(['/account', '/x'])).toBe('/account');
  });

  it.each([
    ['missing', undefined],
    ['empty', ''],
    ['a number', 42],
    ['another host', 'https://example.org/'],
    ['a protocol-relative URL', '//example.org/'],
    ['a backslash trick', '/\\example.org'],
    ['a relative path', 'tanks/1'],
    ['a javascript: URL', 'javascript:alert(1)'],
    ['an embedded tab', '/\t/example.org'],
    ['an embedded newline', '/tanks\n//x'],
    ['the sign-in page itself', '/sign-in?next=/x'],
    ['the reset page', '/reset-password'],
    ['an absurdly long value', '/' + 'a'.repeat(600)],
  ])('answers / for %s', (_label, value) => {
    expect(safeNextPath(value)).toBe('/');
  });
});

describe('signInHref', () => {
  it('carries the current path as an encoded next parameter', () => {
    expect(signInHref('/tanks/abc')).toBe('/sign-in?next=%2Ftanks%2Fabc');
  });

  it('leaves next off for the home page', () => {
    expect(signInHref('/')).toBe('/sign-in');
  });
});
