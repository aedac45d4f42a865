import type { ReactNode } from 'react';
import { Redirect, useGlobalSearchParams, usePathname } from 'expo-router';
import { useMe } from '@/hooks/use-session';
import { safeNextPath } from '@/lib/safe-next';

/** Pages that make sense while signed in too (a reset link opened in a signed-in browser). */
const OPEN_TO_SIGNED_IN = ['/reset-password'];

/**
 * Wraps the sign-in pages. Once someone is signed in (already, or just now by this form) it
 * sends them to `?next=` or home, so the forms themselves never navigate after success.
 */
export function SignedOutGate({ children }: { children: ReactNode }) {
  const pathname = usePathname();
  const { next } = useGlobalSearchParams<{ next?: string }>();
  const me = useMe();
  if (me.data && !OPEN_TO_SIGNED_IN.includes(pathname)) return <Redirect href={safeNextPath(next)} />;
  return <>{children}</>;
}
