import { describe, expect, it } from 'vitest';
import { activeNavKey, navItems } from '@/components/nav/nav-items';
import { layoutSizeForWidth } from '@/lib/layout-size';
import { breakpoints } from '@/constants/theme';

describe('activeNavKey', () => {
  it.each([
    ['/', 'tanks'],
    ['/tanks/0b7c', 'tanks'],
    ['/account', 'account'],
    ['/tanksomething', null],
    ['/dev/outbox', null],
  ])('puts %s under %s', (path, key) => {
    expect(activeNavKey(path)).toBe(key);
  });

  it('has one item per key, each with a label for screen readers', () => {
    expect(new Set(navItems.map((i) => i.key)).size).toBe(navItems.length);
    for (const item of navItems) expect(item.a11y.length).toBeGreaterThan(0);
  });
});

describe('layoutSizeForWidth', () => {
  it('switches exactly at the token breakpoints', () => {
    expect(layoutSizeForWidth(390)).toBe('phone');
    expect(layoutSizeForWidth(breakpoints.tablet - 1)).toBe('phone');
    expect(layoutSizeForWidth(breakpoints.tablet)).toBe('tablet');
    expect(layoutSizeForWidth(breakpoints.wide - 1)).toBe('tablet');
    expect(layoutSizeForWidth(breakpoints.wide)).toBe('wide');
  });
});
