import { useState } from 'react';
import { View } from 'react-native';
import type { ReadingBasis, ReadingItem } from '@/shared/schemas/tank';
import { useAddReading } from '@/hooks/use-readings';
import { usePreferences } from '@/hooks/use-preferences';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { TEMPERATURE_UNIT_LABEL, formatNitrogen, nitrogenUnit } from '@/lib/units-format';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { AppText, Heading } from '@/components/ui/text';
import { ChoiceGroup } from '@/components/settings/choice-group';
import {
  EMPTY_QUICK_TEST,
  lastValues,
  localStamp,
  mapReadingErrors,
  quickTestInput,
  type QuickTestField,
  type QuickTestValues,
} from '@/components/readings/quick-test-model';

/**
 * Logging a water test at the tank: large fields, the kit's basis one tap away, the last
 * test's values one tap away, one tap to save. What was typed stays until it is saved.
 */
export function QuickTestForm({ tankId, last }: { tankId: string; last: ReadingItem | null }) {
  const { space } = useTheme();
  const prefs = usePreferences();
  const [basis, setBasis] = useState<ReadingBasis | null>(null);
  const kitBasis = basis ?? prefs.nitrogenBasis;
  const [values, setValues] = useState<QuickTestValues>(EMPTY_QUICK_TEST);
  const [errors, setErrors] = useState<Partial<Record<QuickTestField, string>>>({});
  const [banner, setBanner] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const add = useAddReading(tankId);
  const t = TEMPERATURE_UNIT_LABEL[prefs.temperatureUnit];

  const set = (f: QuickTestField) => (text: string) => {
    setValues((v) => ({ ...v, [f]: text }));
    setErrors(({ [f]: _cleared, ...rest }) => rest);
    setBanner(null);
    setSaved(null);
  };

  const save = () => {
    const result = quickTestInput(values, kitBasis, prefs.temperatureUnit, new Date());
    if (!result.ok) {
      setErrors(result.fields);
      return;
    }
    add.mutate(result.input, {
      onSuccess: (r) => {
        setValues(EMPTY_QUICK_TEST);
        setErrors({});
        const parts = [
          r.tanMgN === null ? null : `total ammonia ${formatNitrogen(r.tanMgN, 'tanMgN', kitBasis)}`,
          r.no2MgN === null ? null : `nitrite ${formatNitrogen(r.no2MgN, 'no2MgN', kitBasis)}`,
          r.no3MgN === null ? null : `nitrate ${formatNitrogen(r.no3MgN, 'no3MgN', kitBasis)}`,
        ].filter(Boolean);
        setSaved(`Saved the test of ${localStamp(new Date(r.takenAt))}${parts.length ? `: ${parts.join(', ')}` : ''}.`);
      },
      onError: (e) => {
        if (isApiRequestError(e) && Object.keys(e.fields).length) setErrors(mapReadingErrors(e.fields));
        else setBanner(e instanceof Error ? e.message : 'Something went wrong.');
      },
    });
  };

  const nField = (f: 'tan' | 'no2' | 'no3', label: string, key: 'tanMgN' | 'no2MgN' | 'no3MgN') => (
    <View style={{ flexGrow: 1, flexBasis: 120 }}>
      <TextField
        label={`${label} (${nitrogenUnit(key, kitBasis)})`}
        testID={`quick-test-${f}`}
        value={values[f]}
        onChangeText={set(f)}
        error={errors[f]}
        inputMode="decimal"
        keyboardType="decimal-pad"
       
      />
    </View>
  );

  return (
    <View style={{ gap: space.md }} testID="quick-test">
      <Heading level={2}>Log a water test</Heading>
      <ChoiceGroup
        label="Your kit reads"
        testID="quick-test-basis"
        value={kitBasis}
        onChange={setBasis}
        choices={[
          { value: 'N', label: 'As N', a11y: 'As nitrogen: NH4-N, NO2-N, NO3-N' },
          { value: 'ion', label: 'As the ion', a11y: 'As the ion: NH4+, NO2−, NO3−' },
        ]}
      />
      {last ? (
        <Button
          variant="secondary"
          label="Start from the last test's values"
          testID="quick-test-use-last"
          onPress={() => {
            setValues((v) => ({ ...v, ...lastValues(last, kitBasis, prefs.temperatureUnit) }));
            setErrors({});
          }}
        />
      ) : null}
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md, alignItems: 'flex-end' }}>
        {nField('tan', 'Total ammonia', 'tanMgN')}
        {nField('no2', 'Nitrite', 'no2MgN')}
        {nField('no3', 'Nitrate', 'no3MgN')}
      </View>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md, alignItems: 'flex-end' }}>
        <View style={{ flexGrow: 1, flexBasis: 100 }}>
          <TextField label="pH" testID="quick-test-ph" value={values.ph} onChangeText={set('ph')} error={errors.ph} inputMode="decimal" />
        </View>
        <View style={{ flexGrow: 1, flexBasis: 100 }}>
          <TextField label={`Temperature (${t})`} testID="quick-test-temperature" value={values.temperature} onChangeText={set('temperature')} error={errors.temperature} inputMode="decimal" />
        </View>
        <View style={{ flexGrow: 1, flexBasis: 100 }}>
          <TextField label="KH (°dKH)" testID="quick-test-kh" value={values.kh} onChangeText={set('kh')} error={errors.kh} inputMode="decimal" />
        </View>
      </View>
      <TextField
        label="When"
        hint="Leave empty for now, or write 2026-03-01 08:30."
        testID="quick-test-when"
        value={values.when}
        onChangeText={set('when')}
        error={errors.when}
        placeholder="now"
      />
      <TextField label="Note (optional)" testID="quick-test-note" value={values.note} onChangeText={set('note')} error={errors.note} maxLength={200} />
      {banner ? <Banner tone="danger" title="Not saved" message={banner} testID="quick-test-error" /> : null}
      <Button label="Save test" busy={add.isPending} busyLabel="Saving…" onPress={save} testID="quick-test-save" fullWidth />
      {saved ? (
        <AppText tone="okText" weight="bold" testID="quick-test-saved" accessibilityLiveRegion="polite">
          {`✓ ${saved}`}
        </AppText>
      ) : null}
    </View>
  );
}
