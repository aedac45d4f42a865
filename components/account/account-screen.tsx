import { View } from 'react-native';
import type { ClubRole } from '@/shared/schemas/auth';
import { useMe, useSignOut } from '@/hooks/use-session';
import { useTheme } from '@/hooks/use-theme';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { StatusPill } from '@/components/ui/status-pill';
import { AppText, Heading } from '@/components/ui/text';

const clubRoleLabel: Record<ClubRole, string> = { organizer: 'Organizer', mentor: 'Mentor', member: 'Member' };

/** Who is signed in, their clubs and roles, and signing out. */
export function AccountScreen() {
  const { space } = useTheme();
  const me = useMe().data;
  const signOut = useSignOut();
  if (!me) return null; // The signed-in layout only renders this with a person.

  return (
    <Screen testID="screen-account" title="Account">
      <Heading>Account</Heading>
      <Card testID="account-who">
        <AppText variant="title" weight="bold">
          {me.displayName}
        </AppText>
        <AppText tone="textMuted" testID="account-email">
          {me.email}
        </AppText>
        {me.role === 'admin' ? <StatusPill tone="info" label="Site admin" /> : null}
      </Card>

      <Card testID="account-clubs" style={{ gap: space.md }}>
        <Heading level={2}>Clubs</Heading>
        {me.clubs.length === 0 ? (
          <AppText tone="textMuted">You are not in a club. A club organizer can invite you by e-mail.</AppText>
        ) : (
          me.clubs.map((club) => (
            <View key={club.id} testID={`club-${club.id}`} style={{ flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center', gap: space.md }}>
              <AppText weight="bold" style={{ flex: 1 }}>
                {club.name}
              </AppText>
              <StatusPill tone="info" label={clubRoleLabel[club.role]} />
            </View>
          ))
        )}
      </Card>

      {signOut.isError ? <Banner tone="danger" title="Could not sign out" message={signOut.error.message} testID="sign-out-error" /> : null}
      <Button
        testID="sign-out"
        label="Sign out"
        variant="secondary"
        busy={signOut.isPending}
        busyLabel="Signing out…"
        onPress={() => signOut.mutate()}
      />
    </Screen>
  );
}
