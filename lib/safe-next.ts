/** Paths a person is never sent back to after signing in (they would loop or make no sense). */
const AUTH_PATHS = ['/sign-in', '/sign-up', '/confirm-sign-up', '/forgot-password', '/reset-password'];

/**
 * The in-app path to return to after sign-in, from an untrusted `?next=` value. Only same-site
 * absolute paths pass; anything else (other hosts, `//host`, `/\host`, schemes, auth pages)
 * answers `/`, so the parameter cannot become an open redirect.
 */
export function safeNextPath(next: unknown): string {
  const value = Array.isArray(next) ? next[0] : next;
  if (typeof value !== 'string' || value.length === 0 || value.length > 512) return '/';
  if (!value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return '/';
  // Control characters and whitespace can be used to smuggle a second URL past a prefix check.
  if (/[\u0000-\u001f\u007f\s\\]/.test(value)) return '/';
  const path = value.split(/[?#]/)[0];
  if (AUTH_PATHS.includes(path)) return '/';
  return value;
}

/** The sign-in href that brings the person back to `pathname` afterwards. */
export function signInHref(pathname: string): string {
  const next = safeNextPath(pathname);
  return next === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(next)}`;
}
