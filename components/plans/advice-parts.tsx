/** What every advice tab shares: its props, the plan's planned addition, and small pieces of layout. */
import type { ReactNode } from 'react';
import { View } from 'react-native';
import type { z } from 'zod';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { plainNumber } from '@/shared/forecast-view';
import type { ScenarioEvent } from '@/simulation/scenario';
import type { TankDetail } from '@/shared/schemas/tank';
import type { planOutcomeSchema } from '@/simulation/advice/schemas';
import { AppText } from '@/components/ui/text';
import { crossingShare } from '@/simulation/advice/explain';

type Outcome = z.infer<typeof planOutcomeSchema>;

export interface AdvicePanelProps {
  tank: TankDetail;
  planId: string;
  events: readonly ScenarioEvent[];
  /** The plan's start date (YYYY-MM-DD): advice days are also shown as dates. */
  startDate: string;
  /** Applies a schedule to the draft; false when it would move an addition earlier than planned. */
  onApplySchedule(schedule: ScenarioEvent[]): boolean;
}

/** The fish the plan adds: the first kind of its first add event, with the plan's total of that kind. */
export function plannedAddition(events: readonly ScenarioEvent[]) {
  const groups = events.flatMap((e) => (e.type === 'add-fish' ? e.fish : []));
  if (groups.length === 0) return null;
  const first = groups[0];
  const same = groups.filter((g) => g.species === first.species && g.name === first.name);
  return { ...first, count: same.reduce((n, g) => n + g.count, 0) };
}

export function errorText(e: unknown): string {
  if (isApiRequestError(e)) return Object.values(e.fields)[0] ?? e.message;
  return 'Something went wrong. Try again.';
}

export function Words({ lines, testID }: { lines: readonly string[]; testID?: string }) {
  const { space } = useTheme();
  return (
    <View testID={testID} style={{ gap: space.xs }}>
      {lines.map((l) => (
        <AppText key={l}>{l}</AppText>
      ))}
    </View>
  );
}

/** Peak of the binding limit and days over it, at the band's upper edge (what advice judges by). */
export function OutcomeFigures({ title, outcome, labels, testID }: { title: string; outcome: Outcome; labels: Record<string, string>; testID: string }) {
  const { space, colors, radii } = useTheme();
  const edge = outcome.upperEdge;
  const worst = edge.limits.find((l) => l.key === edge.binding) ?? edge.limits[0];
  const over = edge.limits.reduce((m, l) => Math.max(m, l.daysOver), 0);
  return (
    <View testID={testID} style={{ flex: 1, minWidth: 140, gap: space.xxs, padding: space.sm, borderWidth: 1, borderColor: colors.border, borderRadius: radii.md }}>
      <AppText weight="bold">{title}</AppText>
      <AppText tone={edge.safe ? 'okText' : 'dangerText'}>{edge.safe ? 'Stays under the limits' : 'Goes over a limit'}</AppText>
      {worst ? <AppText variant="caption">{`Highest: ${plainNumber(worst.peakRatio * 100)} % of the ${labels[worst.key] ?? worst.key} limit, day ${Math.round(worst.peakDay)}`}</AppText> : null}
      <AppText variant="caption">{`Days over a limit: ${plainNumber(over)}`}</AppText>
      <AppText variant="caption" tone="textMuted">{crossingShare(outcome.membersCrossing, outcome.members)}</AppText>
    </View>
  );
}

export function Section({ children, testID }: { children: ReactNode; testID: string }) {
  const { space } = useTheme();
  return (
    <View testID={testID} style={{ gap: space.md }}>
      {children}
    </View>
  );
}

