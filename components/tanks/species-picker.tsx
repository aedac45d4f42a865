import { useState } from 'react';
import { Pressable, View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { CATALOGUE, findSpecies } from '@/simulation/catalogue';
import { AppText } from '@/components/ui/text';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { pickerOptions } from '@/components/tanks/catalogue-search';

/** A picked animal: a catalogue species, or the keeper's own fish by name (then `speciesId` is null). */
export interface SpeciesChoice {
  speciesId: string | null;
  customName: string;
}

export const NO_SPECIES: SpeciesChoice = { speciesId: null, customName: '' };

export interface SpeciesPickerProps {
  label: string;
  value: SpeciesChoice;
  onChange(value: SpeciesChoice): void;
  /** Shown under the search field (or the chosen fish) in the danger colour. */
  error?: string;
  /** Catalogue ids listed first, and alone before anything is typed (the tank's own fish). */
  preferred?: readonly string[];
  /** Offer the typed words as the keeper's own fish (off where only known fish make sense). */
  allowCustom?: boolean;
  testID: string;
}

/**
 * Find a fish by its common (or scientific) name and pick it, or name your own: the one species
 * picker of the app (livestock, plan events). Shows plain names only, never catalogue ids.
 */
export function SpeciesPicker({ label, value, onChange, error, preferred = [], allowCustom = true, testID }: SpeciesPickerProps) {
  const { colors, radii, space, layout } = useTheme();
  const [query, setQuery] = useState('');
  const chosen = value.speciesId ? findSpecies(value.speciesId) : undefined;
  const custom = !value.speciesId && value.customName.trim() ? value.customName.trim() : null;

  if (chosen || custom) {
    return (
      <View style={{ gap: space.xs }} testID={testID}>
        <AppText variant="label" weight="bold">
          {label}
        </AppText>
        <View style={{ flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' }}>
          <View style={{ flexShrink: 1, flexGrow: 1, flexBasis: 160 }}>
            <AppText weight="bold" testID={`${testID}-chosen`}>{`✓ ${chosen ? chosen.commonName : custom}`}</AppText>
            <AppText variant="caption" tone="textMuted">
              {chosen ? `${chosen.scientificName} · about ${chosen.adultLengthCm} cm adult (approximate)` : 'Your own fish, not from the catalogue'}
            </AppText>
          </View>
          <Button
            label="Change"
            variant="secondary"
            accessibilityLabel={`Change ${label.toLowerCase()}: ${chosen ? chosen.commonName : custom}`}
            onPress={() => {
              setQuery(custom ?? '');
              onChange(NO_SPECIES);
            }}
            testID={`${testID}-change`}
          />
        </View>
        {error ? (
          <AppText variant="caption" tone="dangerText" weight="bold">
            {`Error: ${error}`}
          </AppText>
        ) : null}
      </View>
    );
  }

  const { results, offerCustom } = pickerOptions(CATALOGUE, query, preferred);
  const typed = query.trim();
  return (
    <View style={{ gap: space.sm }} testID={testID}>
      <TextField
        label={label}
        hint="Type part of its name, e.g. neon, then pick it."
        value={query}
        onChangeText={setQuery}
        error={error}
        autoCapitalize="none"
        autoCorrect={false}
        autoComplete="off"
        testID={`${testID}-search`}
      />
      {results.length > 0 ? (
        <View accessibilityRole="radiogroup" accessibilityLabel={`${label}: matches`} style={{ gap: space.xs }}>
          {results.map((e) => (
            <Pressable
              key={e.id}
              accessibilityRole="radio"
              accessibilityState={{ checked: false }}
              aria-checked={false}
              accessibilityLabel={`${e.commonName}, ${e.scientificName}, about ${e.adultLengthCm} cm adult, approximate`}
              testID={`${testID}-option-${e.id}`}
              onPress={() => {
                setQuery('');
                onChange({ speciesId: e.id, customName: '' });
              }}
              style={({ pressed }) => ({
                minHeight: layout.minTouchTarget,
                justifyContent: 'center',
                paddingHorizontal: space.md,
                paddingVertical: space.xs,
                borderRadius: radii.md,
                borderWidth: 1,
                borderColor: colors.border,
                backgroundColor: pressed ? colors.navActiveSurface : colors.surface,
              })}
            >
              <AppText>{e.commonName}</AppText>
              <AppText variant="caption" tone="textMuted">{`${e.scientificName} · about ${e.adultLengthCm} cm adult${e.invertebrate ? ' · shrimp or snail' : ''}`}</AppText>
            </Pressable>
          ))}
        </View>
      ) : null}
      {typed && results.length === 0 ? <AppText tone="textMuted">{allowCustom ? 'No species in the catalogue match.' : 'No species match. Try another name.'}</AppText> : null}
      {allowCustom && offerCustom ? (
        <Button
          label={`Not listed: add “${typed}” as your own fish`}
          variant="quiet"
          onPress={() => {
            setQuery('');
            onChange({ speciesId: null, customName: typed });
          }}
          testID={`${testID}-custom`}
        />
      ) : null}
    </View>
  );
}
