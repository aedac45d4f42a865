import type { ReactNode } from 'react';
import { Redirect, usePathname } from 'expo-router';
import { useMe } from '@/hooks/use-session';
import { signInHref } from '@/lib/safe-next';
import { Screen } from '@/components/ui/screen';
import { Loading, LoadError } from '@/components/ui/load-state';

/**
 * Shows its children only to a signed-in person. Signed out (GET /api/me → 401): off to
 * sign-in, remembering this page. Server unreachable: say so and offer a retry, instead of
 * pretending the person is signed out.
 */
export function SignedInGate({ children }: { children: ReactNode }) {
  const pathname = usePathname();
  const me = useMe();

  if (me.data === null) return <Redirect href={signInHref(pathname)} />;
  if (me.data) return <>{children}</>;
  if (me.isError) {
    return (
      <Screen testID="screen-session-error" title="Cannot reach Shoalshift" width="form" centered>
        <LoadError
          title="Could not check who is signed in"
          error={me.error}
          onRetry={() => void me.refetch()}
          retrying={me.isFetching}
          testID="session-error"
        />
      </Screen>
    );
  }
  return (
    <Screen testID="screen-session-loading" title="Opening" width="form" centered>
      <Loading label="Opening Shoalshift…" />
    </Screen>
  );
}
