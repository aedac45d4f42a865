import { View } from 'react-native';
import { usePreferencesQuery, useSavePreferences } from '@/hooks/use-preferences';
import { useTheme } from '@/hooks/use-theme';
import { DEFAULT_PREFERENCES, type Preferences } from '@/shared/schemas/preferences';
import { formatNitrogen, formatTemperature, formatVolume, nitrogenUnit } from '@/lib/units-format';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { AppText, Heading } from '@/components/ui/text';
import { Loading, LoadError } from '@/components/ui/load-state';
import { ChoiceGroup } from '@/components/settings/choice-group';

/** Units and reminders. Each choice is saved as soon as it is made. */
export function SettingsScreen() {
  const { space } = useTheme();
  const query = usePreferencesQuery();
  const save = useSavePreferences();
  const prefs = save.isPending && save.variables ? save.variables : (query.data ?? DEFAULT_PREFERENCES);
  const set = <K extends keyof Preferences>(key: K) => (value: Preferences[K]) => save.mutate({ ...prefs, [key]: value });

  return (
    <Screen testID="screen-settings" title="Settings">
      <Heading>Settings</Heading>
      {query.isPending ? <Loading label="Loading your settings…" /> : null}
      {query.isError ? <LoadError title="Could not load your settings" error={query.error} onRetry={() => void query.refetch()} retrying={query.isFetching} /> : null}
      {query.data ? (
        <>
          <Card style={{ gap: space.lg }}>
            <Heading level={2}>Units</Heading>
            <AppText tone="textMuted">Shoalshift shows every number in these units, and reads what you type in them.</AppText>
            <ChoiceGroup
              label="Volume"
              testID="settings-volume"
              value={prefs.volumeUnit}
              onChange={set('volumeUnit')}
              choices={[
                { value: 'L', label: 'Litres', a11y: 'Litres' },
                { value: 'USgal', label: 'US gallons', a11y: 'US gallons' },
              ]}
            />
            <ChoiceGroup
              label="Temperature"
              testID="settings-temperature"
              value={prefs.temperatureUnit}
              onChange={set('temperatureUnit')}
              choices={[
                { value: 'C', label: '°C', a11y: 'Degrees Celsius' },
                { value: 'F', label: '°F', a11y: 'Degrees Fahrenheit' },
              ]}
            />
            <ChoiceGroup
              label="Ammonia, nitrite and nitrate"
              hint="Test kits print one of these on the colour card: as nitrogen (NH4-N, NO2-N, NO3-N) or as the ion (NH4+, NO2−, NO3−)."
              testID="settings-basis"
              value={prefs.nitrogenBasis}
              onChange={set('nitrogenBasis')}
              choices={[
                { value: 'N', label: 'As N', a11y: 'As nitrogen' },
                { value: 'ion', label: 'As the ion', a11y: 'As the ion' },
              ]}
            />
            <AppText tone="textMuted" testID="settings-example">
              {`Example: a 120 L tank at 25 °C with nitrate 10 mg/L as N shows as ${formatVolume(120, prefs.volumeUnit)}, ${formatTemperature(25, prefs.temperatureUnit)}, nitrate ${formatNitrogen(10, 'no3MgN', prefs.nitrogenBasis)} ${nitrogenUnit('no3MgN', prefs.nitrogenBasis)}.`}
            </AppText>
          </Card>
          <Card style={{ gap: space.lg }}>
            <Heading level={2}>Reminders</Heading>
            <ChoiceGroup
              label="E-mail me on a plan's test days"
              testID="settings-reminders"
              value={prefs.reminders ? 'on' : 'off'}
              onChange={(v) => set('reminders')(v === 'on')}
              choices={[
                { value: 'on', label: 'On', a11y: 'Reminders on' },
                { value: 'off', label: 'Off', a11y: 'Reminders off' },
              ]}
            />
          </Card>
          <View accessibilityLiveRegion="polite">
            {save.isError ? (
              <Banner tone="danger" title="Not saved" message={save.error.message} testID="settings-error" />
            ) : save.isSuccess ? (
              <AppText tone="okText" weight="bold" testID="settings-saved">
                ✓ Saved
              </AppText>
            ) : null}
          </View>
        </>
      ) : null}
    </Screen>
  );
}
