import { View } from 'react-native';
import type { Preferences } from '@/shared/schemas/preferences';
import { findSpecies } from '@/simulation/catalogue';
import { useTheme } from '@/hooks/use-theme';
import { TEMPERATURE_UNIT_LABEL, VOLUME_UNIT_LABEL } from '@/lib/units-format';
import { TextField } from '@/components/ui/text-field';
import { Button } from '@/components/ui/button';
import { AppText } from '@/components/ui/text';
import { ChoiceGroup } from '@/components/settings/choice-group';
import { FILTER_KIND_CHOICES } from '@/components/tanks/tank-form-model';
import { NO_SPECIES, SpeciesPicker } from '@/components/tanks/species-picker';
import type { LessonFormErrors, LessonTankForm } from './lesson-builder-model';

const SUBSTRATE_LABELS = [
  { value: 'bare', label: 'Bare bottom' },
  { value: 'sand', label: 'Sand' },
  { value: 'gravel', label: 'Gravel' },
] as const;

const START_LABELS = [
  { value: 'mature', label: 'Settled', a11y: 'Settled: its biofilter matches the fish already in it' },
  { value: 'new', label: 'Brand new', a11y: 'Brand new: hardly any filter bacteria yet' },
] as const;

/** Count a species gets when picked; the mentor changes it in the row (common community group size). */
const NEW_ROW_COUNT = '6';

/**
 * The lesson's tank: size and water in the mentor's units, filter and substrate (the zones
 * come from the same presets as a keeper's tank), how it starts, its usual water change and
 * the fish already swimming in it. Messages sit under their fields.
 */
export function LessonTankFields({
  tank,
  onChange,
  errors,
  units,
}: {
  tank: LessonTankForm;
  onChange(patch: Partial<LessonTankForm>, touched: string): void;
  errors: LessonFormErrors;
  units: Preferences;
}) {
  const { space } = useTheme();
  const set = (key: 'volume' | 'temperature' | 'ph' | 'kh' | 'waterChangePercent' | 'waterChangeEveryDays') => (text: string) => onChange({ [key]: text }, `tank.${key}`);
  const setRow = (i: number, count: string) => onChange({ fish: tank.fish.map((r, j) => (j === i ? { ...r, count } : r)) }, `tank.fish.${i}.count`);

  return (
    <View style={{ gap: space.lg }} testID="lesson-tank">
      <View style={{ flexDirection: 'row', gap: space.md }}>
        <View style={{ flex: 1, minWidth: 0 }}>
          <TextField label={`Volume (${VOLUME_UNIT_LABEL[units.volumeUnit]})`} testID="lesson-tank-volume" value={tank.volume} onChangeText={set('volume')} error={errors['tank.volume']} inputMode="decimal" />
        </View>
        <View style={{ flex: 1, minWidth: 0 }}>
          <TextField label={`Temperature (${TEMPERATURE_UNIT_LABEL[units.temperatureUnit]})`} testID="lesson-tank-temperature" value={tank.temperature} onChangeText={set('temperature')} error={errors['tank.temperature']} inputMode="decimal" />
        </View>
      </View>
      <View style={{ flexDirection: 'row', gap: space.md }}>
        <View style={{ flex: 1, minWidth: 0 }}>
          <TextField label="pH" testID="lesson-tank-ph" value={tank.ph} onChangeText={set('ph')} error={errors['tank.ph']} inputMode="decimal" />
        </View>
        <View style={{ flex: 1, minWidth: 0 }}>
          <TextField label="KH (°dKH)" testID="lesson-tank-kh" value={tank.kh} onChangeText={set('kh')} error={errors['tank.kh']} inputMode="decimal" placeholder="optional" />
        </View>
      </View>
      <AppText variant="caption" tone="textMuted">Without KH the pH stays as typed; with it, the pH drifts down as the filter bacteria use the carbonate up.</AppText>
      <ChoiceGroup label="Filter" testID="lesson-tank-filter" value={tank.filterKind} onChange={(v) => onChange({ filterKind: v }, 'tank.filterKind')} choices={FILTER_KIND_CHOICES} />
      <ChoiceGroup
        label="Substrate"
        hint="With some rock and wood; filter media sized to the tank (about 1 L per 100 L)."
        testID="lesson-tank-substrate"
        value={tank.substrate}
        onChange={(v) => onChange({ substrate: v }, 'tank.substrate')}
        choices={SUBSTRATE_LABELS}
      />
      <ChoiceGroup
        label="How the tank starts"
        hint={tank.start === 'mature' ? 'Settled: its biofilter has grown to the fish listed below, and no more.' : 'Brand new: hardly any filter bacteria yet, whatever fish it holds.'}
        testID="lesson-tank-start"
        value={tank.start}
        onChange={(v) => onChange({ start: v }, 'tank.start')}
        choices={START_LABELS}
      />
      <View style={{ flexDirection: 'row', gap: space.md }}>
        <View style={{ flex: 1, minWidth: 0 }}>
          <TextField label="Water change (%)" testID="lesson-tank-wc-percent" value={tank.waterChangePercent} onChangeText={set('waterChangePercent')} error={errors['tank.waterChangePercent']} inputMode="decimal" />
        </View>
        <View style={{ flex: 1, minWidth: 0 }}>
          <TextField label="Every (days)" testID="lesson-tank-wc-every" value={tank.waterChangeEveryDays} onChangeText={set('waterChangeEveryDays')} error={errors['tank.waterChangeEveryDays']} inputMode="numeric" />
        </View>
      </View>
      <AppText variant="caption" tone="textMuted">The tank’s usual water change, repeated through the forecast; 0 % for none.</AppText>

      <View style={{ gap: space.sm }} testID="lesson-tank-fish">
        <AppText variant="label" weight="bold">Fish already in the tank on day 0</AppText>
        {tank.fish.length === 0 ? <AppText tone="textMuted">None: an empty tank.</AppText> : null}
        {tank.fish.map((row, i) => {
          const name = findSpecies(row.species)?.commonName ?? row.species;
          return (
            <View key={`${row.species}-${i}`} style={{ gap: space.xxs }} testID={`lesson-fish-${i}`}>
              <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'flex-end' }}>
                <View style={{ flex: 1, minWidth: 0 }}>
                  <TextField label={`${name}: how many`} testID={`lesson-fish-${i}-count`} value={row.count} onChangeText={(v) => setRow(i, v)} error={errors[`tank.fish.${i}.count`]} inputMode="numeric" />
                </View>
                <View style={{ paddingBottom: errors[`tank.fish.${i}.count`] ? space.xl : 0 }}>
                  <Button variant="quiet" label="Remove" accessibilityLabel={`Remove the ${name}`} onPress={() => onChange({ fish: tank.fish.filter((_, j) => j !== i) }, `tank.fish.${i}`)} testID={`lesson-fish-${i}-remove`} />
                </View>
              </View>
              {errors[`tank.fish.${i}.species`] ? <AppText tone="dangerText" weight="bold" variant="caption">{`Error: ${errors[`tank.fish.${i}.species`]}`}</AppText> : null}
            </View>
          );
        })}
        <SpeciesPicker
          label="Add a species"
          value={NO_SPECIES}
          allowCustom={false}
          onChange={(c) => {
            if (c.speciesId) onChange({ fish: [...tank.fish, { species: c.speciesId, count: NEW_ROW_COUNT }] }, 'tank.fish');
          }}
          testID="lesson-fish-picker"
        />
      </View>
    </View>
  );
}
