import { useMemo } from 'react';
import { Pressable, View } from 'react-native';
import { CATALOGUE } from '@/simulation/catalogue';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';
import { searchCatalogue } from '@/components/tanks/catalogue-search';

/** Catalogue species matching `query`, as a radio list (adding animals; the fish an emptied filter fed). */
export function SpeciesChoices({ query, selectedId, onSelect, max = 8, testIDPrefix = 'species' }: { query: string; selectedId: string | null; onSelect(id: string): void; max?: number; testIDPrefix?: string }) {
  const { colors, radii, space, layout } = useTheme();
  const results = useMemo(() => searchCatalogue(CATALOGUE, query).slice(0, max), [query, max]);
  return (
    <View accessibilityRole="radiogroup" accessibilityLabel="Species" style={{ gap: space.xs }}>
      {results.map((e) => {
        const selected = e.id === selectedId;
        return (
          <Pressable
            key={e.id}
            accessibilityRole="radio"
            accessibilityState={{ checked: selected }}
            aria-checked={selected}
            accessibilityLabel={`${e.commonName}, ${e.scientificName}, about ${e.adultLengthCm} cm adult, approximate`}
            testID={`${testIDPrefix}-${e.id}`}
            onPress={() => onSelect(e.id)}
            style={{
              minHeight: layout.minTouchTarget,
              justifyContent: 'center',
              paddingHorizontal: space.md,
              paddingVertical: space.xs,
              borderRadius: radii.md,
              borderWidth: selected ? 2 : 1,
              borderColor: selected ? colors.primary : colors.border,
              backgroundColor: selected ? colors.navActiveSurface : colors.surface,
            }}
          >
            <AppText weight={selected ? 'bold' : 'regular'}>{`${selected ? '✓ ' : ''}${e.commonName}`}</AppText>
            <AppText variant="caption" tone="textMuted">{`${e.scientificName} · about ${e.adultLengthCm} cm adult (approximate)${e.invertebrate ? ' · invertebrate' : ''}`}</AppText>
          </Pressable>
        );
      })}
      {results.length === 0 ? <AppText tone="textMuted">No species match. Try another name.</AppText> : null}
    </View>
  );
}
