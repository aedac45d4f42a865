import { View } from 'react-native';
import { useMe } from '@/hooks/use-session';
import { useTankList } from '@/hooks/use-tanks';
import { usePreferences } from '@/hooks/use-preferences';
import { ButtonLink } from '@/components/ui/button-link';
import { useTheme } from '@/hooks/use-theme';
import { Screen } from '@/components/ui/screen';
import { AppText, Heading } from '@/components/ui/text';
import { Loading, LoadError } from '@/components/ui/load-state';
import { TankCard } from '@/components/tanks/tank-card';
import { NoTanksYet } from '@/components/tanks/no-tanks-yet';

/** The keeper's tanks at a glance. */
export function HomeScreen() {
  const { space } = useTheme();
  const me = useMe();
  const tanks = useTankList();
  const units = usePreferences();
  const now = new Date();
  const list = tanks.data?.tanks;

  return (
    <Screen testID="screen-home" title="Your tanks">
      <View style={{ gap: space.xs }}>
        <Heading>Your tanks</Heading>
        {me.data ? (
          <AppText tone="textMuted">
            {list && list.length > 0
              ? `${me.data.displayName}, you keep ${list.length} ${list.length === 1 ? 'tank' : 'tanks'}. Open one for its stock, tests and plans.`
              : `Welcome, ${me.data.displayName}.`}
          </AppText>
        ) : null}
      </View>

      <NewTankLink />

      {tanks.isPending ? <Loading label="Loading your tanks…" testID="home-loading" /> : null}
      {tanks.isError ? (
        <LoadError
          title="Could not load your tanks"
          error={tanks.error}
          onRetry={() => void tanks.refetch()}
          retrying={tanks.isFetching}
          testID="home-error"
        />
      ) : null}
      {list && list.length === 0 ? <NoTanksYet /> : null}
      {list && list.length > 0 ? (
        <View testID="tank-list" style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.lg }}>
          {list.map((tank) => (
            <TankCard key={tank.id} tank={tank} now={now} units={units} />
          ))}
        </View>
      ) : null}
    </Screen>
  );
}

/** The way to a new tank, as a button-sized link (≥ 44 px). */
function NewTankLink() {
  return <ButtonLink href="/tanks/new" label="+ New tank" accessibilityLabel="Add a new tank" testID="home-new-tank" />;
}
