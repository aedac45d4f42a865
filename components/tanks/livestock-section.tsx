import { useState } from 'react';
import { View } from 'react-native';
import type { LivestockItem } from '@/shared/schemas/tank';
import { CATALOGUE } from '@/simulation/catalogue';
import { useAddLivestock, useRemoveLivestock, useUpdateLivestock } from '@/hooks/use-tanks';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { parseDecimal, trimNumber } from '@/lib/units-format';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { AppText } from '@/components/ui/text';
import { ChoiceGroup } from '@/components/settings/choice-group';
import { speciesDisplayName } from '@/components/tanks/tank-labels';
import { SpeciesChoices } from '@/components/tanks/species-choices';

const MAX_RESULTS = 8;

/** The tank's animals: change a count, remove a group, add from the catalogue or a custom fish. */
export function LivestockSection({ tankId, livestock }: { tankId: string; livestock: readonly LivestockItem[] }) {
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
      <AddLivestock tankId={tankId} />
    </View>
  );
}

function AddLivestock({ tankId }: { tankId: string }) {
  const { colors, space } = useTheme();
  const add = useAddLivestock(tankId);
  const [kind, setKind] = useState<'catalogue' | 'custom'>('catalogue');
  const [search, setSearch] = useState('');
  const [speciesId, setSpeciesId] = useState<string | null>(null);
  const [customName, setCustomName] = useState('');
  const [count, setCount] = useState('1');
  const [length, setLength] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState<string | null>(null);
  const chosen = CATALOGUE.find((e) => e.id === speciesId) ?? null;

  const submit = () => {
    const n = parseDecimal(count);
    const l = parseDecimal(length);
    const bad: Record<string, string> = {};
    if (n === null || Number.isNaN(n)) bad.count = 'Enter how many, as a whole number.';
    if (Number.isNaN(l)) bad.lengthCm = 'Enter a length in cm, or leave it empty.';
    if (kind === 'catalogue' && !speciesId) bad.speciesId = 'Choose a species from the list.';
    if (Object.keys(bad).length) return setErrors(bad);
    const input = kind === 'catalogue' ? { speciesId: speciesId!, count: n!, lengthCm: l } : { customName, count: n!, lengthCm: l };
    add.mutate(input, {
      onSuccess: (item) => {
        setDone(`Added ${item.count} ${speciesDisplayName(item)}.`);
        setErrors({});
        setSpeciesId(null);
        setSearch('');
        setCustomName('');
        setCount('1');
        setLength('');
      },
      onError: (e) => setErrors(isApiRequestError(e) && Object.keys(e.fields).length ? { ...e.fields } : { _: e.message }),
    });
  };

  return (
    <View style={{ gap: space.md, borderTopWidth: 1, borderTopColor: colors.border, paddingTop: space.md }} testID="livestock-add">
      <ChoiceGroup
        label="Add animals"
        testID="livestock-kind"
        value={kind}
        onChange={(k) => {
          setKind(k);
          setErrors({});
        }}
        choices={[
          { value: 'catalogue', label: 'From the catalogue' },
          { value: 'custom', label: 'Custom fish' },
        ]}
      />
      {kind === 'catalogue' ? (
        <View style={{ gap: space.sm }}>
          <TextField label="Search species" hint="Common or scientific name." testID="livestock-search" value={search} onChangeText={setSearch} error={errors.speciesId} autoComplete="off" />
          <AppText variant="caption" tone="textMuted">
            Catalogue lengths are typical adult sizes and approximate; enter your fish's real length if you know it.
          </AppText>
          <SpeciesChoices
            query={search}
            selectedId={speciesId}
            max={MAX_RESULTS}
            onSelect={(id) => {
              setSpeciesId(id);
              setErrors(({ speciesId: _s, ...rest }) => rest);
              setDone(null);
            }}
          />
          {chosen ? <AppText weight="bold" testID="livestock-chosen">{`Chosen: ${chosen.commonName}`}</AppText> : null}
        </View>
      ) : (
        <TextField label="Name" testID="livestock-custom-name" value={customName} onChangeText={setCustomName} error={errors.customName} maxLength={80} />
      )}
      <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
        <View style={{ flexGrow: 1, flexBasis: 120 }}>
          <TextField label="How many" testID="livestock-count" value={count} onChangeText={setCount} error={errors.count} inputMode="numeric" keyboardType="number-pad" />
        </View>
        <View style={{ flexGrow: 1, flexBasis: 120 }}>
          <TextField
            label={kind === 'custom' ? 'Length (cm)' : 'Length now (cm, optional)'}
            testID="livestock-length"
            value={length}
            onChangeText={setLength}
            error={errors.lengthCm}
            placeholder={chosen ? `about ${chosen.adultLengthCm}` : ''}
            inputMode="decimal"
          />
        </View>
      </View>
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
