import { useMemo } from 'react';
import { View } from 'react-native';
import { usePlan, usePlanForecast } from '@/hooks/use-plans';
import { planForecastVersion } from '@/lib/query-keys';
import { useTankDetail } from '@/hooks/use-tanks';
import { usePreferences } from '@/hooks/use-preferences';
import { useLayoutSize } from '@/hooks/use-breakpoint';
import { SchemeOverrideContext, useTheme } from '@/hooks/use-theme';
import { startLine, startWarningLines } from '@/shared/start-words';
import { ESTIMATE_CAUTIONS } from '@/simulation/advice/cautions';
import { MAIN_PANELS } from '@/lib/forecast-panels';
import { unitsSummary } from '@/lib/units-format';
import type { PlanDetail, PlanForecastResponse } from '@/shared/schemas/plan';
import type { Preferences } from '@/shared/schemas/preferences';
import type { TankDetail } from '@/shared/schemas/tank';
import { Screen } from '@/components/ui/screen';
import { Button } from '@/components/ui/button';
import { TextLink } from '@/components/ui/text-link';
import { AppText, Heading } from '@/components/ui/text';
import { Loading, LoadError } from '@/components/ui/load-state';
import { PrintHint } from '@/components/ui/print-hint';
import { ForecastChart } from '@/components/forecast/forecast-chart';
import { ForecastVerdict } from '@/components/forecast/forecast-verdict';
import { fishLists, IF_HIGH, keepInMind, printDays, printLimits, readingColumns, tankFacts, type PrintDay } from '@/components/plans/print-plan-model';

/** Widest chart on paper: fits A4 and US Letter portrait inside the browser's print margins. */
const PAPER_CHART_WIDTH = 640;

/**
 * A plan to print and hand over: the tank and its fish, the limits, the forecast, a day-by-day
 * table with empty boxes for the readings, and what to do if a reading is high. Always light
 * (it is for paper); the Back and Print controls are left off the printout.
 */
export function PrintPlanScreen({ id }: { id: string }) {
  return (
    <SchemeOverrideContext.Provider value="light">
      <PrintPage id={id} />
    </SchemeOverrideContext.Provider>
  );
}

function PrintPage({ id }: { id: string }) {
  const { space } = useTheme();
  const plan = usePlan(id);
  const tank = useTankDetail(plan.data?.tankId ?? '');
  const forecast = usePlanForecast(id, plan.data && tank.data ? planForecastVersion(plan.data.updatedAt, tank.data) : undefined);
  const prefs = usePreferences();
  return (
    <Screen testID="screen-print-plan" title={plan.data ? `Print: ${plan.data.name}` : 'Printable plan'}>
      <PrintHint hint="hide" style={{ gap: space.sm }} testID="print-controls">
        <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap', alignItems: 'center' }}>
          <TextLink href={`/plans/${id}`} label="← Back to the plan" testID="print-back" />
          <Button label="Print" variant="secondary" onPress={() => globalThis.print?.()} testID="print-button" />
        </View>
        <AppText variant="caption" tone="textMuted">These links and buttons stay off the paper.</AppText>
      </PrintHint>
      {plan.isPending || (plan.data && tank.isPending) ? <Loading label="Loading the plan…" /> : null}
      {plan.isError ? <LoadError title="Could not load the plan" error={plan.error} onRetry={() => void plan.refetch()} retrying={plan.isFetching} /> : null}
      {tank.isError ? <LoadError title="Could not load the tank" error={tank.error} onRetry={() => void tank.refetch()} retrying={tank.isFetching} /> : null}
      {plan.data && tank.data ? <PrintBody plan={plan.data} tank={tank.data} forecast={forecast.data} prefs={prefs} /> : null}
    </Screen>
  );
}

function Section({ title, children, testID }: { title: string; children: React.ReactNode; testID?: string }) {
  const { space } = useTheme();
  return (
    <View style={{ gap: space.xs }} testID={testID}>
      <Heading level={2}>{title}</Heading>
      {children}
    </View>
  );
}

function PrintBody({ plan, tank, forecast, prefs }: { plan: PlanDetail; tank: TankDetail; forecast: PlanForecastResponse | undefined; prefs: Preferences }) {
  const { space, colors } = useTheme();
  const wide = useLayoutSize() === 'wide';
  const days = useMemo(() => printDays(plan), [plan]);
  const facts = tankFacts(tank, prefs);
  const fish = fishLists(tank, plan);
  const cautions = keepInMind(forecast?.cautions ?? ESTIMATE_CAUTIONS);
  const view = forecast?.forecast;

  const about = (
    <View style={{ gap: space.lg, flex: wide ? 1 : undefined, minWidth: 0 }}>
      <Section title="The tank" testID="print-tank">
        {facts.map((f) => (
          <AppText key={f.label}>
            <AppText weight="bold">{`${f.label}: `}</AppText>
            {f.value}
          </AppText>
        ))}
      </Section>
      <Section title="Fish" testID="print-fish">
        <AppText weight="bold">In the tank at the start</AppText>
        <AppText>{fish.now.length > 0 ? fish.now.join(', ') : 'No fish yet'}</AppText>
        {fish.added.length > 0 ? (
          <>
            <AppText weight="bold">Added by this plan</AppText>
            <AppText>{fish.added.join(', ')}</AppText>
          </>
        ) : null}
        {fish.leaving.length > 0 ? (
          <>
            <AppText weight="bold">Leaving with this plan</AppText>
            <AppText>{fish.leaving.join(', ')}</AppText>
          </>
        ) : null}
      </Section>
      {view ? (
        <Section title="Limits" testID="print-limits">
          {printLimits(view, prefs.nitrogenBasis).map((l) => (
            <PrintHint hint="keep" key={l.name} style={{ gap: space.xxs }}>
              <AppText>
                <AppText weight="bold">{`${l.name}: `}</AppText>
                {l.value}
              </AppText>
              <AppText variant="caption" tone="textMuted">
                {l.basis}
              </AppText>
            </PrintHint>
          ))}
        </Section>
      ) : null}
    </View>
  );
  const chart = (
    <View style={{ gap: space.sm, flex: wide ? 1 : undefined, minWidth: 0 }}>
      <Section title="What the forecast expects" testID="print-forecast">
        {view && forecast ? (
          <>
            <ForecastVerdict view={view} basis={prefs.nitrogenBasis} compact testID="print-verdict" />
            <AppText variant="caption" tone="textMuted">
              {[startLine(forecast.startState, prefs.nitrogenBasis), ...startWarningLines(forecast.startState, prefs.nitrogenBasis), 'Shaded: where 8 in 10 likely forecasts fall.'].join(' ')}
            </AppText>
            <View style={{ maxWidth: PAPER_CHART_WIDTH }}>
              <ForecastChart view={view} basis={prefs.nitrogenBasis} showBand events={plan.events} only={MAIN_PANELS} testID="print-chart" />
            </View>
          </>
        ) : (
          <Loading label="Running the forecast…" />
        )}
      </Section>
    </View>
  );

  return (
    <View style={{ gap: space.xl }}>
      <View style={{ gap: space.xxs }}>
        <Heading testID="print-title">{plan.name}</Heading>
        <AppText>{`${plan.tankName} · day 0 is ${plan.startDate}`}</AppText>
        <AppText variant="caption" tone="textMuted">{`Units: ${unitsSummary(prefs)}. Made with Shoalshift; a forecast is an estimate, your water tests decide.`}</AppText>
      </View>
      <PrintHint hint="stack" style={{ flexDirection: wide ? 'row' : 'column', gap: space.xl, alignItems: 'flex-start' }}>
        {about}
        {chart}
      </PrintHint>
      <Section title="Day by day" testID="print-days">
        <AppText variant="caption" tone="textMuted">Tick what you did and write each reading in its box.</AppText>
        <DayTable days={days} basis={prefs.nitrogenBasis} wide={wide} />
      </Section>
      <PrintHint hint="keep">
        <Section title="If a reading is high" testID="print-if-high">
          {IF_HIGH.map((l) => (
            <AppText key={l}>{`• ${l}`}</AppText>
          ))}
        </Section>
      </PrintHint>
      <PrintHint hint="keep">
        <Section title="Keep in mind" testID="print-keep-in-mind">
          {cautions.map((c) => (
            <AppText key={c}>{`• ${c}`}</AppText>
          ))}
        </Section>
      </PrintHint>
      <View style={{ borderTopWidth: 1, borderTopColor: colors.border }} />
    </View>
  );
}

const READING_BOX = 76;

/** An empty box to write a reading in on paper; the column heading (or caption above) names it. */
function ReadingBox() {
  const { colors, radii } = useTheme();
  return (
    <View
      style={{ width: READING_BOX, height: 30, borderWidth: 1, borderColor: colors.fieldBorder, borderRadius: radii.sm, backgroundColor: colors.surface }}
    />
  );
}

/** The day rows; wide: a table with a column per reading; narrow: the boxes under each day's tasks. */
function DayTable({ days, basis, wide }: { days: readonly PrintDay[]; basis: Preferences['nitrogenBasis']; wide: boolean }) {
  const { space, colors } = useTheme();
  const columns = readingColumns(basis);
  const tasks = (d: PrintDay) => (
    <View style={{ gap: space.xxs, flex: 1, minWidth: 0 }}>
      {d.todo.map((t) => (
        <AppText key={t} weight="bold">{`☐ ${t}`}</AppText>
      ))}
      {d.tests.map((t) => (
        <AppText key={t}>{`☐ ${t}`}</AppText>
      ))}
    </View>
  );
  const dayCell = (d: PrintDay) => (
    <View style={{ width: wide ? 104 : undefined }}>
      <AppText weight="bold">{`Day ${d.day}`}</AppText>
      <AppText variant="caption" tone="textMuted">
        {d.date}
      </AppText>
    </View>
  );
  return (
    <View testID="print-day-rows">
      {wide ? null : <AppText variant="caption" tone="textMuted">{`Readings in ${[...new Set(columns.map((c) => c.unit))].join(', ')}.`}</AppText>}
      {wide ? (
        <View style={{ flexDirection: 'row', gap: space.md, paddingBottom: space.xs, borderBottomWidth: 2, borderBottomColor: colors.border }}>
          <AppText variant="caption" weight="bold" style={{ width: 104 }}>
            Day
          </AppText>
          <AppText variant="caption" weight="bold" style={{ flex: 1 }}>
            What to do and test
          </AppText>
          {columns.map((c) => (
            <AppText key={c.key} variant="caption" weight="bold" style={{ width: READING_BOX }}>
              {`${c.title} (${c.unit})`}
            </AppText>
          ))}
        </View>
      ) : null}
      {days.map((d) => (
        <PrintHint
          hint="keep"
          key={d.day}
          testID={`print-day-${d.day}`}
          style={{ borderBottomWidth: 1, borderBottomColor: colors.border, paddingVertical: space.sm, gap: space.sm, flexDirection: wide ? 'row' : 'column' }}
        >
          {dayCell(d)}
          {tasks(d)}
          <View style={{ flexDirection: 'row', gap: wide ? space.md : space.sm, flexWrap: 'wrap' }}>
            {columns.map((c) => (
              <View key={c.key} style={{ gap: space.xxs }}>
                {wide ? null : <AppText variant="caption">{c.title}</AppText>}
                <ReadingBox />
              </View>
            ))}
          </View>
        </PrintHint>
      ))}
    </View>
  );
}
