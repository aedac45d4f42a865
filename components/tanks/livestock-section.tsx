import { useMemo, useState } from 'react';
import { View } from 'react-native';
import type { LivestockItem } from '@/shared/schemas/tank';
import { findSpecies } from '@/simulation/catalogue';
import { useAddLivestock, useRemoveLivestock, useUpdateLivestock } from '@/hooks/use-tanks';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { usePreferences } from '@/hooks/use-preferences';
import { formatVolume, parseDecimal, trimNumber } from '@/lib/units-format';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { AppText } from '@/components/ui/text';
import { speciesDisplayName } from '@/components/tanks/tank-labels';
import { NO_SPECIES, SpeciesPicker, type SpeciesChoice } from '@/components/tanks/species-picker';
import { livestockStocking } from '@/components/tanks/livestock-stocking';

/** The tank's animals: change a count, remove a group, add from the catalogue or a custom fish. */
export function LivestockSection({ tankId, volumeL, livestock }: { tankId: string; volumeL: number; livestock: readonly LivestockItem[] }) {
  const { space } = useTheme();
  const update = useUpdateLivestock(tankId);
  const remove = useRemoveLivestock(tankId);
  return (
    <View style={{ gap: space.md }}>
      {livestock.length === 0 ? <AppText tone="textMuted">No fish or invertebrates recorded.</AppText> : null}
      {livestock.map((item) => {
        const name = speciesDisplayName(item);
        const busy = (update.isPending && update.variables?.id === item.id) || (remove.isPending && remove.variables === item.id);
        return (
          <View key={item.id} testID={`livestock-${item.id}`} style={{ gap: space.xs }}>
            <AppText weight="bold">{`${name}${item.lengthCm === null ? '' : ` · ${trimNumber(item.lengthCm, 1)} cm`}`}</AppText>
            <View style={{ flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' }}>
              <Button variant="secondary" label="−" accessibilityLabel={`One fewer ${name}`} disabled={busy || item.count <= 1} onPress={() => update.mutate({ id: item.id, patch: { count: item.count - 1 } })} testID={`livestock-${item.id}-fewer`} />
              <AppText variant="title" weight="bold" testID={`livestock-${item.id}-count`} accessibilityLabel={`${item.count} ${name}`}>
                {String(item.count)}
              </AppText>
              <Button variant="secondary" label="+" accessibilityLabel={`One more ${name}`} disabled={busy} onPress={() => update.mutate({ id: item.id, patch: { count: item.count + 1 } })} testID={`livestock-${item.id}-more`} />
              <Button variant="quiet" label="Remove" accessibilityLabel={`Remove all ${name} from this tank`} disabled={busy} onPress={() => remove.mutate(item.id)} testID={`livestock-${item.id}-remove`} />
            </View>
          </View>
        );
      })}
      {update.isError || remove.isError ? <Banner tone="danger" title="Not changed" message={(update.error ?? remove.error)?.message} /> : null}
      <AddLivestock tankId={tankId} volumeL={volumeL} livestock={livestock} />
    </View>
  );
}

function AddLivestock({ tankId, volumeL, livestock }: { tankId: string; volumeL: number; livestock: readonly LivestockItem[] }) {
  const { colors, space } = useTheme();
  const prefs = usePreferences();
  const add = useAddLivestock(tankId);
  const [choice, setChoice] = useState<SpeciesChoice>(NO_SPECIES);
  const [count, setCount] = useState('1');
  const [length, setLength] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState<string | null>(null);
  const chosen = choice.speciesId ? findSpecies(choice.speciesId) ?? null : null;
  const custom = !choice.speciesId && choice.customName.trim() !== '';

  const warning = useMemo(() => {
    const n = parseDecimal(count);
    const l = parseDecimal(length);
    if (n === null || !Number.isInteger(n) || n < 1 || Number.isNaN(l)) return null;
    const group = chosen ? { species: chosen.id, count: n, ...(l ? { lengthCm: l } : {}) } : custom && l ? { name: choice.customName.trim(), count: n, lengthCm: l } : null;
    return livestockStocking(volumeL, formatVolume(volumeL, prefs.volumeUnit), livestock, group);
  }, [count, length, chosen, custom, choice.customName, volumeL, prefs.volumeUnit, livestock]);

  const submit = () => {
    const n = parseDecimal(count);
    const l = parseDecimal(length);
    const bad: Record<string, string> = {};
    if (n === null || Number.isNaN(n)) bad.count = 'Enter how many, as a whole number.';
    if (Number.isNaN(l)) bad.lengthCm = 'Enter a length in cm, or leave it empty.';
    if (!chosen && !custom) bad.speciesId = 'Choose a species from the list, or add your own fish.';
    if (custom && l === null) bad.lengthCm = 'Enter the length of your own fish in cm, so its waste can be estimated.';
    if (Object.keys(bad).length) return setErrors(bad);
    const input = chosen ? { speciesId: chosen.id, count: n!, lengthCm: l } : { customName: choice.customName.trim(), count: n!, lengthCm: l };
    add.mutate(input, {
      onSuccess: (item) => {
        setDone(`Added ${item.count} ${speciesDisplayName(item)}.`);
        setErrors({});
        setChoice(NO_SPECIES);
        setCount('1');
        setLength('');
      },
      onError: (e) => setErrors(isApiRequestError(e) && Object.keys(e.fields).length ? { ...e.fields } : { _: e.message }),
    });
  };

  return (
    <View style={{ gap: space.md, borderTopWidth: 1, borderTopColor: colors.border, paddingTop: space.md }} testID="livestock-add">
      <SpeciesPicker
        label="Add animals"
        value={choice}
        onChange={(c) => {
          setChoice(c);
          setErrors(({ speciesId: _s, customName: _c, ...rest }) => rest);
          setDone(null);
        }}
        error={errors.speciesId ?? errors.customName}
        testID="livestock-species"
      />
      <AppText variant="caption" tone="textMuted">
        Catalogue lengths are typical adult sizes and approximate; enter your fish's real length if you know it.
      </AppText>
      <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
        <View style={{ flexGrow: 1, flexBasis: 120 }}>
          <TextField label="How many" testID="livestock-count" value={count} onChangeText={setCount} error={errors.count} inputMode="numeric" keyboardType="number-pad" />
        </View>
        <View style={{ flexGrow: 1, flexBasis: 120 }}>
          <TextField
            label="Length (cm)"
            testID="livestock-length"
            value={length}
            onChangeText={setLength}
            error={errors.lengthCm}
            placeholder={chosen ? `about ${chosen.adultLengthCm}` : ''}
            inputMode="decimal"
          />
        </View>
      </View>
      {warning ? <Banner tone="watch" title="A lot of fish for this tank" message={warning} testID="livestock-stocking-warning" /> : null}
      {errors._ ? <Banner tone="danger" title="Not added" message={errors._} /> : null}
      <Button label="Add to tank" busy={add.isPending} busyLabel="Adding…" onPress={submit} testID="livestock-submit" />
      {done ? (
        <AppText tone="okText" weight="bold" testID="livestock-added">
          {`✓ ${done}`}
        </AppText>
      ) : null}
    </View>
  );
}
