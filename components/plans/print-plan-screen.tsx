import { useMemo } from 'react';
import { View } from 'react-native';
import { usePlan, usePlanForecast } from '@/hooks/use-plans';
import { useTheme } from '@/hooks/use-theme';
import { addDays } from '@/shared/plan-check-days';
import { forecastSentences, START_SENTENCES } from '@/shared/forecast-view';
import type { PlanDetail } from '@/shared/schemas/plan';
import { Screen } from '@/components/ui/screen';
import { Button } from '@/components/ui/button';
import { TextLink } from '@/components/ui/text-link';
import { AppText, Heading } from '@/components/ui/text';
import { Loading, LoadError } from '@/components/ui/load-state';
import { SCREEN_CAUTIONS } from '@/components/forecast/cautions-list';
import { describeEvent } from '@/components/plans/event-fields';

/** One row of the printed plan: what to do and what to test on one day. */
export interface PrintDay {
  day: number;
  date: string;
  todo: string[];
  tests: string[];
}

/** The plan's days that have something to do or test, in order. */
export function printDays(plan: PlanDetail): PrintDay[] {
  const byDay = new Map<number, PrintDay>();
  const at = (day: number) => {
    const d = Math.round(day);
    if (!byDay.has(d)) byDay.set(d, { day: d, date: addDays(plan.startDate, d), todo: [], tests: [] });
    return byDay.get(d)!;
  };
  for (const e of plan.events) at(e.day).todo.push(describeEvent(e));
  for (const c of plan.checkDays) at(c.day).tests.push(`Test total ammonia and nitrite (${c.reasons.join('; ')})`);
  return [...byDay.values()].sort((a, b) => a.day - b.day);
}

/** If a reading is high (common practice; the same steps the cautions give). */
export const IF_HIGH = [
  'Total ammonia or nitrite over the limit: change 25–50 % of the water with treated, temperature-matched water the same day.',
  'Feed half or skip a day; do not add more fish until two tests in a row are back under the limits.',
  'Test again the next day; repeat the water change if it is still high.',
  'Fish gasping, lying on the bottom or with red gills: act now, and ask a qualified aquatic veterinarian.',
];

/** A plain, printable page: what to do on which day, what to test, what to do if readings are high. */
export function PrintPlanScreen({ id }: { id: string }) {
  const { space, colors } = useTheme();
  const plan = usePlan(id);
  const forecast = usePlanForecast(id, plan.data?.updatedAt);
  const days = useMemo(() => (plan.data ? printDays(plan.data) : []), [plan.data]);
  return (
    <Screen testID="screen-print-plan" title={plan.data ? `Print: ${plan.data.name}` : 'Printable plan'}>
      {plan.isPending ? <Loading label="Loading the plan…" /> : null}
      {plan.isError ? <LoadError title="Could not load the plan" error={plan.error} onRetry={() => void plan.refetch()} retrying={plan.isFetching} /> : null}
      {plan.data ? (
        <View style={{ gap: space.lg }}>
          <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
            <TextLink href={`/plans/${id}`} label="← Back to the plan" testID="print-back" />
            <Button label="Print" variant="secondary" onPress={() => globalThis.print?.()} testID="print-button" />
          </View>
          <Heading testID="print-title">{plan.data.name}</Heading>
          <AppText>{`${plan.data.tankName} · starts ${plan.data.startDate}`}</AppText>
          {forecast.data ? (
            <View testID="print-forecast" style={{ gap: space.xs }}>
              <Heading level={2}>What the forecast expects</Heading>
              {[START_SENTENCES[forecast.data.startReason], ...forecastSentences(forecast.data.forecast)].map((l) => (
                <AppText key={l}>{l}</AppText>
              ))}
            </View>
          ) : null}
          <Heading level={2}>Day by day</Heading>
          <View testID="print-days">
            {days.map((d) => (
              <View key={d.day} style={{ borderTopWidth: 1, borderTopColor: colors.border, paddingVertical: space.sm, gap: space.xxs }}>
                <AppText weight="bold">{`Day ${d.day} · ${d.date}`}</AppText>
                {d.todo.map((t) => (
                  <AppText key={t}>{`☐ ${t}`}</AppText>
                ))}
                {d.tests.map((t) => (
                  <AppText key={t} tone="textMuted">{`☐ ${t}`}</AppText>
                ))}
              </View>
            ))}
          </View>
          <Heading level={2}>If a reading is high</Heading>
          <View testID="print-if-high">
            {IF_HIGH.map((l) => (
              <AppText key={l}>{`• ${l}`}</AppText>
            ))}
          </View>
          <Heading level={2}>Keep in mind</Heading>
          {[...new Set([...SCREEN_CAUTIONS, ...(forecast.data?.cautions ?? [])])].map((c) => (
            <AppText key={c} variant="caption">{`• ${c}`}</AppText>
          ))}
        </View>
      ) : null}
    </Screen>
  );
}
