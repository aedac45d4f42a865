import { Pressable, View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import type { ScenarioEvent } from '@/simulation/scenario';
import { addDays } from '@/shared/plan-check-days';
import { AppText } from '@/components/ui/text';
import { Button } from '@/components/ui/button';
import { describeEvent } from '@/components/plans/event-fields';

export interface EventTimelineProps {
  events: readonly ScenarioEvent[];
  /** The plan's first day; a lesson has none, so its events show the day number only. */
  startDate?: string;
  selected: number | null;
  onSelect(index: number | null): void;
  onRemove(index: number): void;
}

/** The plan's events by day; tap one to edit it. Indexes are positions in `events`. */
export function EventTimeline({ events, startDate, selected, onSelect, onRemove }: EventTimelineProps) {
  const { colors, space, radii, layout } = useTheme();
  const order = events.map((e, i) => ({ e, i })).sort((a, b) => a.e.day - b.e.day || a.i - b.i);
  if (events.length === 0) return <AppText tone="textMuted" testID="timeline-empty">No events yet: add the first one below.</AppText>;
  return (
    <View testID="event-timeline" style={{ gap: space.xs }} role="list">
      {order.map(({ e, i }) => {
        const isSelected = selected === i;
        return (
          <View key={i} role="listitem" style={{ flexDirection: "row", alignItems: "center", gap: space.sm }}>
            <Pressable
              testID={`event-${i}`}
              accessibilityRole="button"
              accessibilityState={{ selected: isSelected }}
              accessibilityLabel={`Day ${e.day}: ${describeEvent(e)}. ${isSelected ? 'Open for editing' : 'Edit'}`}
              onPress={() => onSelect(isSelected ? null : i)}
              style={{
                flex: 1,
                minHeight: layout.minTouchTarget,
                flexDirection: 'row',
                gap: space.md,
                alignItems: 'center',
                padding: space.sm,
                borderRadius: radii.md,
                borderWidth: isSelected ? 2 : 1,
                borderColor: isSelected ? colors.focus : colors.border,
                backgroundColor: isSelected ? colors.surfaceRaised : colors.surface,
              }}
            >
              <View style={{ minWidth: 64 }}>
                <AppText weight="bold">{`Day ${e.day}`}</AppText>
                {startDate ? <AppText variant="caption" tone="textMuted">{addDays(startDate, e.day)}</AppText> : null}
              </View>
              <AppText style={{ flex: 1 }}>{describeEvent(e)}</AppText>
            </Pressable>
            <Button label="Remove" variant="quiet" onPress={() => onRemove(i)} accessibilityLabel={`Remove day ${e.day}: ${describeEvent(e)}`} testID={`event-remove-${i}`} />
          </View>
        );
      })}
    </View>
  );
}
