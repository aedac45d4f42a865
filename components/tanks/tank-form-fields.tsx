import { useState } from 'react';
import { View } from 'react-native';
import type { Preferences } from '@/shared/schemas/preferences';
import { defaultSetup, TANK_DEFAULTS } from '@/shared/schemas/tank';
import { PLANTING_LEVELS } from '@/simulation/scenario';
import { useTheme } from '@/hooks/use-theme';
import { TEMPERATURE_UNIT_LABEL, VOLUME_UNIT_LABEL, nitrogenUnit, temperatureInputText, volumeInputText } from '@/lib/units-format';
import { parseDecimal, volumeToLitres } from '@/lib/units-format';
import { TextField } from '@/components/ui/text-field';
import { Button } from '@/components/ui/button';
import { AppText } from '@/components/ui/text';
import { ChoiceGroup } from '@/components/settings/choice-group';
import {
  AERATION_CHOICES,
  FILTER_KIND_CHOICES,
  HARDSCAPE_CHOICES,
  SUBSTRATE_CHOICES,
  type TankFormField,
  type TankFormValues,
} from '@/components/tanks/tank-form-model';

const words = (s: string) => (s === '' ? "Filter's own" : (s.charAt(0).toUpperCase() + s.slice(1)).replace(/-/g, ' '));

/**
 * The tank form's fields: name, volume and filter kind up front; everything else under
 * "More about this tank", each with its default as the placeholder.
 */
export function TankFormFields({
  values,
  set,
  errors,
  units,
  testIDPrefix,
  startOpen = false,
}: {
  values: TankFormValues;
  set: <K extends TankFormField>(key: K) => (value: TankFormValues[K]) => void;
  errors: Partial<Record<TankFormField, string>>;
  units: Preferences;
  testIDPrefix: string;
  startOpen?: boolean;
}) {
  const { space } = useTheme();
  const [more, setMore] = useState(startOpen);
  const v = VOLUME_UNIT_LABEL[units.volumeUnit];
  const t = TEMPERATURE_UNIT_LABEL[units.temperatureUnit];
  const typedVolume = parseDecimal(values.volume);
  const litres = typedVolume && typedVolume > 0 ? volumeToLitres(typedVolume, units.volumeUnit) : 100;
  const defaults = defaultSetup(litres, values.filterKind);
  const id = (s: string) => `${testIDPrefix}-${s}`;
  const hasMoreErrors = (['mediaVolume', 'temperature', 'ph', 'kh', 'tapTan', 'tapNo2', 'tapNo3', 'substrateDepthCm', 'lightHours'] as const).some((f) => errors[f]);

  return (
    <View style={{ gap: space.lg }}>
      <TextField label="Name" testID={id('name')} value={values.name} onChangeText={set('name')} error={errors.name} autoComplete="off" maxLength={80} />
      <TextField
        label={`Volume (${v})`}
        hint="The water the tank holds, roughly."
        testID={id('volume')}
        value={values.volume}
        onChangeText={set('volume')}
        error={errors.volume}
        inputMode="decimal"
        keyboardType="decimal-pad"
      />
      <ChoiceGroup label="Filter" testID={id('filter')} value={values.filterKind} onChange={set('filterKind')} choices={FILTER_KIND_CHOICES} />

      <Button
        variant="secondary"
        label={more ? 'Hide the details' : 'More about this tank'}
        accessibilityLabel={more ? 'Hide the details of this tank' : 'More about this tank: temperature, water, filter media, substrate, rock, plants, light'}
        accessibilityState={{ expanded: more }}
        testID={id('more')}
        onPress={() => setMore((m) => !m)}
      />
      {hasMoreErrors && !more ? (
        <AppText tone="dangerText" weight="bold">
          Error: some details need attention. Open "More about this tank".
        </AppText>
      ) : null}

      {more ? (
        <View style={{ gap: space.lg }} testID={id('details')}>
          <AppText tone="textMuted">Fields left empty take the default shown in grey.</AppText>
          <TextField label={`Temperature (${t})`} testID={id('temperature')} value={values.temperature} onChangeText={set('temperature')} error={errors.temperature} placeholder={`${temperatureInputText(TANK_DEFAULTS.temperatureC, units.temperatureUnit)} (default)`} inputMode="decimal" />
          <TextField label="pH" testID={id('ph')} value={values.ph} onChangeText={set('ph')} error={errors.ph} placeholder={`${TANK_DEFAULTS.ph} (default)`} inputMode="decimal" />
          <TextField label="Carbonate hardness, KH (°dKH)" testID={id('kh')} value={values.kh} onChangeText={set('kh')} error={errors.kh} placeholder="not known" inputMode="decimal" />
          <AppText variant="label" weight="bold">
            Tap water
          </AppText>
          <AppText variant="caption" tone="textMuted">
            Chloramine-treated tap water carries ammonia. Test it once and enter it here.
          </AppText>
          <TextField label={`Tap total ammonia (${nitrogenUnit('tanMgN', units.nitrogenBasis)})`} testID={id('tap-tan')} value={values.tapTan} onChangeText={set('tapTan')} error={errors.tapTan} placeholder="0" inputMode="decimal" />
          <TextField label={`Tap nitrite (${nitrogenUnit('no2MgN', units.nitrogenBasis)})`} testID={id('tap-no2')} value={values.tapNo2} onChangeText={set('tapNo2')} error={errors.tapNo2} placeholder="0" inputMode="decimal" />
          <TextField label={`Tap nitrate (${nitrogenUnit('no3MgN', units.nitrogenBasis)})`} testID={id('tap-no3')} value={values.tapNo3} onChangeText={set('tapNo3')} error={errors.tapNo3} placeholder="0" inputMode="decimal" />
          <TextField
            label={`Filter media volume (${v})`}
            hint="Sponge, rings or carriers in the filter (approximate)."
            testID={id('media')}
            value={values.mediaVolume}
            onChangeText={set('mediaVolume')}
            error={errors.mediaVolume}
            placeholder={`${volumeInputText(defaults.filter!.mediaVolumeL, units.volumeUnit)} (default)`}
            inputMode="decimal"
          />
          <ChoiceGroup label="Substrate" testID={id('substrate')} value={values.substrate} onChange={set('substrate')} choices={SUBSTRATE_CHOICES.map((c) => ({ value: c, label: c === 'bare' ? 'Bare bottom' : words(c) }))} />
          {values.substrate !== 'bare' ? (
            <TextField label="Substrate depth (cm)" testID={id('depth')} value={values.substrateDepthCm} onChangeText={set('substrateDepthCm')} error={errors.substrateDepthCm} placeholder="5 (default)" inputMode="decimal" />
          ) : null}
          <ChoiceGroup label="Rock and wood" testID={id('hardscape')} value={values.hardscape} onChange={set('hardscape')} choices={HARDSCAPE_CHOICES.map((c) => ({ value: c, label: words(c) }))} />
          <ChoiceGroup label="Plants" testID={id('plants')} value={values.plants} onChange={set('plants')} choices={PLANTING_LEVELS.map((c) => ({ value: c, label: words(c) }))} />
          <ChoiceGroup label="Aeration" testID={id('aeration')} value={values.aeration} onChange={set('aeration')} choices={AERATION_CHOICES.map((c) => ({ value: c, label: words(c) }))} />
          <TextField label="Light (hours a day)" testID={id('light')} value={values.lightHours} onChangeText={set('lightHours')} error={errors.lightHours} placeholder={`${TANK_DEFAULTS.lightHoursPerDay} (default)`} inputMode="decimal" />
          <TextField
            label="Usual water change (%)"
            hint="Use 0 if you do none. Water changes dilute nitrate and bring back the carbonate hardness (KH) that filter bacteria use up."
            testID={id('water-change-percent')}
            value={values.waterChangePercent}
            onChangeText={set('waterChangePercent')}
            error={errors.waterChangePercent}
            placeholder={`${TANK_DEFAULTS.routineWaterChange.percent} (default)`}
            inputMode="decimal"
          />
          <TextField
            label="Every (days)"
            testID={id('water-change-every')}
            value={values.waterChangeEveryDays}
            onChangeText={set('waterChangeEveryDays')}
            error={errors.waterChangeEveryDays}
            placeholder={`${TANK_DEFAULTS.routineWaterChange.everyDays} (default)`}
            inputMode="numeric"
          />
          <TextField label="Notes" testID={id('notes')} value={values.notes} onChangeText={set('notes')} error={errors.notes} multiline maxLength={2000} />
        </View>
      ) : null}
    </View>
  );
}
