/** The app's top-level places, in the order the bar and rail show them. */
export const navItems = [
  { key: 'tanks', label: 'Tanks', href: '/', a11y: 'Your tanks' },
  { key: 'plans', label: 'Plans', href: '/plans', a11y: 'Your plans' },
  { key: 'clubs', label: 'Clubs', href: '/clubs', a11y: 'Your clubs and lessons' },
  { key: 'settings', label: 'Settings', href: '/settings', a11y: 'Units and reminders' },
  { key: 'account', label: 'Account', href: '/account', a11y: 'Your account' },
] as const;

export type NavKey = (typeof navItems)[number]['key'];

/** Which place a path belongs to (tank pages count as Tanks); null for pages outside the bar. */
export function activeNavKey(pathname: string): NavKey | null {
  if (pathname === '/' || pathname === '/tanks' || pathname.startsWith('/tanks/')) return 'tanks';
  if (/^\/(clubs|lessons)(\/|$)/.test(pathname)) return 'clubs';
  if (pathname === '/settings' || pathname.startsWith('/settings/')) return 'settings';
  if (pathname === '/plans' || pathname.startsWith('/plans/')) return 'plans';
  if (pathname === '/account' || pathname.startsWith('/account/')) return 'account';
  return null;
}
