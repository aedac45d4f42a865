import { Pressable, ScrollView, View } from 'react-native';
import type { LimitLevel, ReadingItem } from '@/shared/schemas/tank';
import type { Preferences } from '@/shared/schemas/preferences';
import { judgeLatest } from '@/shared/tank-status';
import { useTheme } from '@/hooks/use-theme';
import { compactDate } from '@/lib/format';
import { TEMPERATURE_UNIT_LABEL, basisWords, formatNitrogen, temperatureIn, trimNumber } from '@/lib/units-format';
import { AppText } from '@/components/ui/text';

const dash = (v: number | null, digits: number) => (v === null ? '—' : trimNumber(v, digits));

/** Words for a value's standing against its limit; colour only repeats them. */
export const LEVEL_WORDS: Record<LimitLevel, string> = { ok: 'OK', watch: 'Watch', over: 'Over limit' };
const LEVEL_TONE = { ok: 'okText', watch: 'watchText', over: 'dangerText' } as const;

type Column = { key: string; title: string; width: number };

/**
 * Water tests, newest first, in the person's units. Total ammonia and nitrite are judged
 * against the tank's limits at the test's own pH and temperature; a value at or over half its
 * limit says "Watch", over it "Over limit", in words under the number.
 */
export function ReadingsTable({
  readings,
  now,
  units,
  tank,
  onDelete,
  deletingId,
}: {
  readings: readonly ReadingItem[];
  now: Date;
  units: Preferences;
  tank: { ph: number; temperatureC: number };
  onDelete?: (reading: ReadingItem) => void;
  deletingId?: string | null;
}) {
  const { colors, space, layout } = useTheme();
  const b = units.nitrogenBasis;
  const columns: Column[] = [
    { key: 'date', title: 'Date', width: 84 },
    { key: 'tan', title: 'Total ammonia', width: 96 },
    { key: 'no2', title: 'Nitrite', width: 90 },
    { key: 'no3', title: 'Nitrate', width: 74 },
    { key: 'ph', title: 'pH', width: 56 },
    { key: 'temp', title: TEMPERATURE_UNIT_LABEL[units.temperatureUnit], width: 60 },
    { key: 'kh', title: 'KH (°dKH)', width: 80 },
    { key: 'note', title: 'Note', width: 160 },
    ...(onDelete ? [{ key: 'delete', title: '', width: 84 }] : []),
  ];

  const cell = (r: ReadingItem, key: string, judged: ReturnType<typeof judgeLatest>) => {
    const mark = (k: 'tanMgN' | 'no2MgN') => judged.find((j) => j.key === k);
    switch (key) {
      case 'date':
        return <AppText>{compactDate(r.takenAt, now)}</AppText>;
      case 'tan':
      case 'no2': {
        const k = key === 'tan' ? 'tanMgN' : 'no2MgN';
        const j = mark(k);
        return (
          <>
            <AppText weight="bold">{formatNitrogen(r[k], k, b)}</AppText>
            {j && j.level !== 'ok' ? (
              <AppText variant="caption" weight="bold" tone={LEVEL_TONE[j.level]} testID={`reading-${r.id}-${key}-level`}>
                {LEVEL_WORDS[j.level]}
              </AppText>
            ) : null}
          </>
        );
      }
      case 'no3':
        return <AppText weight="bold">{formatNitrogen(r.no3MgN, 'no3MgN', b)}</AppText>;
      case 'ph':
        return <AppText>{dash(r.ph, 2)}</AppText>;
      case 'temp':
        return <AppText>{r.temperatureC === null ? '—' : trimNumber(temperatureIn(r.temperatureC, units.temperatureUnit), 1)}</AppText>;
      case 'kh':
        return <AppText>{dash(r.khDkh, 1)}</AppText>;
      case 'note':
        return <AppText variant="caption">{r.note ?? ''}</AppText>;
      case 'delete':
        return (
          <Pressable
            accessibilityRole="button"
            accessibilityLabel={`Delete the test of ${compactDate(r.takenAt, now)}`}
            testID={`reading-delete-${r.id}`}
            disabled={deletingId === r.id}
            onPress={() => onDelete?.(r)}
            style={{ minHeight: layout.minTouchTarget, minWidth: layout.minTouchTarget, justifyContent: 'center' }}
          >
            <AppText tone="link" weight="bold">
              {deletingId === r.id ? 'Deleting…' : 'Delete'}
            </AppText>
          </Pressable>
        );
      default:
        return null;
    }
  };

  return (
    <View style={{ gap: space.xs }}>
      <AppText variant="caption" tone="textMuted">{`Ammonia, nitrite and nitrate in mg/L ${basisWords(b)}. A dash means not tested.`}</AppText>
      <ScrollView horizontal accessibilityLabel="Water tests table, scrolls sideways">
        <View {...({ role: 'table' } as object)} testID="readings-table">
          <View {...({ role: 'row' } as object)} style={{ flexDirection: 'row', borderBottomWidth: 2, borderBottomColor: colors.fieldBorder }}>
            {columns.map((c) => (
              <View key={c.key} {...({ role: 'columnheader' } as object)} style={{ width: c.width, paddingVertical: space.sm, paddingRight: space.sm }}>
                <AppText variant="caption" weight="bold" tone="textMuted">
                  {c.title}
                </AppText>
              </View>
            ))}
          </View>
          {readings.map((r) => {
            const judged = judgeLatest(r, tank);
            return (
              <View key={r.id} testID={`reading-row-${r.id}`} {...({ role: 'row' } as object)} style={{ flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.border }}>
                {columns.map((c) => (
                  <View key={c.key} {...({ role: 'cell' } as object)} style={{ width: c.width, paddingVertical: space.sm, paddingRight: space.sm, justifyContent: 'center' }}>
                    {cell(r, c.key, judged)}
                  </View>
                ))}
              </View>
            );
          })}
        </View>
      </ScrollView>
    </View>
  );
}
