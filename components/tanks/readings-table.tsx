import { ScrollView, View } from 'react-native';
import type { ReadingItem } from '@/shared/schemas/tank';
import { useTheme } from '@/hooks/use-theme';
import { compactDate, formatMgPerL } from '@/lib/format';
import { AppText } from '@/components/ui/text';
import { NITROGEN_UNIT } from '@/components/tanks/tank-labels';

const dash = (v: number | null, digits: number) => (v === null ? '—' : v.toFixed(digits));

// Widths: date plus the three nitrogen columns fit a 390 px phone without scrolling.
const COLUMNS = [
  { key: 'date', title: 'Date', width: 84, cell: (r: ReadingItem, now: Date) => compactDate(r.takenAt, now) },
  { key: 'tan', title: 'Total ammonia', width: 84, cell: (r: ReadingItem) => formatMgPerL(r.tanMgN) },
  { key: 'no2', title: 'Nitrite', width: 70, cell: (r: ReadingItem) => formatMgPerL(r.no2MgN) },
  { key: 'no3', title: 'Nitrate', width: 74, cell: (r: ReadingItem) => formatMgPerL(r.no3MgN) },
  { key: 'ph', title: 'pH', width: 56, cell: (r: ReadingItem) => dash(r.ph, 1) },
  { key: 'temp', title: '°C', width: 56, cell: (r: ReadingItem) => dash(r.temperatureC, 1) },
  { key: 'kh', title: 'KH (°dKH)', width: 84, cell: (r: ReadingItem) => dash(r.khDkh, 0) },
] as const;

/**
 * Recent water tests, newest first. Nitrogen columns come right after the date so they stay in
 * view on a phone; the table scrolls sideways for the rest.
 */
export function ReadingsTable({ readings, now }: { readings: readonly ReadingItem[]; now: Date }) {
  const { colors, space } = useTheme();
  return (
    <View style={{ gap: space.xs }}>
      <AppText variant="caption" tone="textMuted">{`Ammonia, nitrite and nitrate in ${NITROGEN_UNIT}. A dash means not tested.`}</AppText>
      <ScrollView horizontal accessibilityLabel="Water tests table, scrolls sideways">
        <View {...({ role: 'table' } as object)} testID="readings-table">
          <View {...({ role: 'row' } as object)} style={{ flexDirection: 'row', borderBottomWidth: 2, borderBottomColor: colors.fieldBorder }}>
            {COLUMNS.map((c) => (
              <View key={c.key} {...({ role: 'columnheader' } as object)} style={{ width: c.width, paddingVertical: space.sm, paddingRight: space.sm }}>
                <AppText variant="caption" weight="bold" tone="textMuted">
                  {c.title}
                </AppText>
              </View>
            ))}
          </View>
          {readings.map((r) => (
            <View
              key={r.id}
              testID={`reading-row-${r.id}`}
              {...({ role: 'row' } as object)}
              style={{ flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.border }}
            >
              {COLUMNS.map((c) => (
                <View key={c.key} {...({ role: 'cell' } as object)} style={{ width: c.width, paddingVertical: space.sm, paddingRight: space.sm }}>
                  <AppText weight={c.key === 'date' ? 'regular' : 'bold'}>{c.cell(r, now)}</AppText>
                </View>
              ))}
            </View>
          ))}
        </View>
      </ScrollView>
    </View>
  );
}
