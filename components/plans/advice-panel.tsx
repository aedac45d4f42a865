import { useState, type ReactNode } from 'react';
import { Pressable, View } from 'react-native';
import type { z } from 'zod';
import { useTheme } from '@/hooks/use-theme';
import { useAdditionAdvice, useCalibration, useCapacityTest, useRemovalAdvice, useRescueAdvice } from '@/hooks/use-plans';
import { useDraftStore, type AdviceTab } from '@/lib/draft-store';
import { isApiRequestError } from '@/lib/api-client';
import { parseDecimal } from '@/lib/units-format';
import { fitWindowWords, fittingLabel } from '@/lib/calibration-progress';
import { plainNumber } from '@/shared/forecast-view';
import type { ScenarioEvent } from '@/simulation/scenario';
import type { TankDetail } from '@/shared/schemas/tank';
import type { planOutcomeSchema } from '@/simulation/advice/schemas';
import { crossingShare, FILTER_BACTERIA_MEANING } from '@/simulation/advice/explain';
import { AppText, Heading } from '@/components/ui/text';
import { Button } from '@/components/ui/button';
import { Banner } from '@/components/ui/banner';
import { TextField } from '@/components/ui/text-field';
import { CautionsList } from '@/components/forecast/cautions-list';
import { speciesDisplayName } from '@/components/tanks/tank-labels';
import { findSpecies } from '@/simulation/catalogue';

type Outcome = z.infer<typeof planOutcomeSchema>;

const TABS: { key: AdviceTab; label: string }[] = [
  { key: 'addition', label: 'How fast' },
  { key: 'removal', label: 'Rehoming' },
  { key: 'rescue', label: 'Rescue' },
  { key: 'calibration', label: 'Fit to my tests' },
  { key: 'capacity-test', label: 'Filter test' },
];

export interface AdvicePanelProps {
  tank: TankDetail;
  planId: string;
  events: readonly ScenarioEvent[];
  onApplySchedule(schedule: ScenarioEvent[]): void;
}

/** The fish the plan adds: species and length of its first add event, the total count of that species. */
export function plannedAddition(events: readonly ScenarioEvent[]) {
  const adds = events.filter((e): e is Extract<ScenarioEvent, { type: 'add-fish' }> => e.type === 'add-fish');
  if (adds.length === 0) return null;
  const first = adds[0].fish;
  const same = adds.filter((e) => e.fish.species === first.species && e.fish.name === first.name);
  return { ...first, count: same.reduce((n, e) => n + e.fish.count, 0) };
}

function errorText(e: unknown): string {
  if (isApiRequestError(e)) return Object.values(e.fields)[0] ?? e.message;
  return 'Something went wrong. Try again.';
}

function Words({ lines, testID }: { lines: readonly string[]; testID?: string }) {
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
function OutcomeFigures({ title, outcome, labels, testID }: { title: string; outcome: Outcome; labels: Record<string, string>; testID: string }) {
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

function Section({ children, testID }: { children: ReactNode; testID: string }) {
  const { space } = useTheme();
  return (
    <View testID={testID} style={{ gap: space.md }}>
      {children}
    </View>
  );
}

function AdditionAdvice({ tank, planId, events, onApplySchedule }: AdvicePanelProps) {
  const { space } = useTheme();
  const advice = useAdditionAdvice(tank.id);
  const fish = plannedAddition(events);
  if (!fish) return <AppText tone="textMuted">This plan adds no fish. Add an “Add fish” event to ask how fast it can go.</AppText>;
  const data = advice.data;
  const labels = Object.fromEntries((data?.limits ?? []).map((l) => [l.key, l.label]));
  const fishName = (fish.species && findSpecies(fish.species)?.commonName) || fish.name || fish.species;
  return (
    <Section testID="advice-addition">
      <AppText>{`How fast can ${fish.count} ${fishName} go in without a spike? The plan's other saved events (water changes, doses) stay.`}</AppText>
      <Button
        label="How fast can it go?"
        busy={advice.isPending}
        busyLabel="Working it out…"
        onPress={() => advice.mutate({ planId, fish, searchDays: 60 })}
        testID="advice-addition-run"
      />
      {advice.isError ? <Banner tone="danger" title="No advice this time" message={errorText(advice.error)} testID="advice-error" /> : null}
      {data ? (
        <View testID="advice-addition-result" style={{ gap: space.md }}>
          <Heading level={3}>
            {data.status === 'all-at-once-is-safe' ? 'All at once looks safe' : data.status === 'staged' ? `In ${data.batches.length} batches` : 'No safe schedule found'}
          </Heading>
          {data.batches.length > 0 ? (
            <View testID="advice-batches">
              {data.batches.map((b) => (
                <AppText key={b.day}>{`Day ${b.day}: ${b.count} fish`}</AppText>
              ))}
            </View>
          ) : null}
          <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
            {data.staged ? <OutcomeFigures title="This schedule" outcome={data.staged} labels={labels} testID="advice-staged" /> : null}
            <OutcomeFigures title="All at once" outcome={data.allAtOnce} labels={labels} testID="advice-all-at-once" />
          </View>
          <AppText testID="advice-binding">{`The limit that sets the pace: ${data.binding.label}, ${plainNumber(data.binding.value)} ${data.binding.unit}.`}</AppText>
          <Words lines={data.explanation} />
          {data.status !== 'no-safe-schedule' && data.events.length > 0 ? (
            <Button
              label="Apply this schedule"
              onPress={() => onApplySchedule(data.events as ScenarioEvent[])}
              accessibilityLabel="Apply this schedule: replaces the plan's add-fish events"
              testID="advice-apply"
            />
          ) : null}
          <CautionsList extra={data.cautions} testID="advice-cautions" />
        </View>
      ) : null}
    </Section>
  );
}

function RemovalAdvice({ tank, planId }: AdvicePanelProps) {
  const { space } = useTheme();
  const advice = useRemovalAdvice(tank.id);
  const stock = tank.livestock.filter((l) => l.count > 0);
  const [which, setWhich] = useState(0);
  const [count, setCount] = useState(String(stock[0]?.count ?? ''));
  const [restock, setRestock] = useState('28');
  const [percent, setPercent] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const item = stock[which];
  if (!item) return <AppText tone="textMuted">This tank has no fish to rehome.</AppText>;
  const run = () => {
    const n = parseDecimal(count);
    const day = parseDecimal(restock);
    const pct = parseDecimal(percent);
    const errs: Record<string, string> = {};
    if (n === null || !Number.isInteger(n) || n < 1 || n > item.count) errs.count = `A whole number from 1 to ${item.count}.`;
    if (day === null || !Number.isInteger(day) || day < 1) errs.restock = 'A whole number of days, 1 or more.';
    if (pct !== null && !(pct > 0 && pct <= 35)) errs.percent = 'Between 0 and 35 % (leave empty if you dose ammonium chloride).';
    setErrors(errs);
    if (Object.keys(errs).length > 0) return;
    advice.mutate({
      planId,
      removals: [{ ...(item.speciesId ? { species: item.speciesId } : { name: item.customName ?? '' }), count: n! }],
      restockDay: day!,
      ...(pct !== null ? { solution: { percentNH3: pct } } : {}),
    });
  };
  const data = advice.data;
  return (
    <Section testID="advice-removal">
      <AppText>Rehoming fish and restocking later? Keep the biofilter fed in between.</AppText>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.xs }}>
        {stock.map((l, i) => (
          <Button key={l.id} label={speciesDisplayName(l)} variant={i === which ? 'primary' : 'secondary'} onPress={() => setWhich(i)} testID={`removal-pick-${i}`} />
        ))}
      </View>
      <TextField label="How many to rehome" value={count} onChangeText={setCount} keyboardType="number-pad" error={errors.count} testID="removal-count" />
      <TextField label="Restock on day" value={restock} onChangeText={setRestock} keyboardType="number-pad" error={errors.restock} testID="removal-restock" />
      <TextField label="Your ammonia solution (% NH3)" hint="Optional: for a dose in mL" value={percent} onChangeText={setPercent} keyboardType="decimal-pad" error={errors.percent} testID="removal-percent" />
      <Button label="Work out the dose" busy={advice.isPending} busyLabel="Working it out…" onPress={run} testID="advice-removal-run" />
      {advice.isError ? <Banner tone="danger" title="No advice this time" message={errorText(advice.error)} /> : null}
      {data ? (
        <View testID="advice-removal-result" style={{ gap: space.sm }}>
          <Heading level={3}>{data.dose.mgNPerLPerDay > 0 ? 'Dose ammonia daily until the restock' : 'No dosing needed'}</Heading>
          {data.dose.mgNPerLPerDay > 0 ? (
            <View testID="removal-dose">
              <AppText>{`${plainNumber(data.dose.mgNPerLPerDay)} mg N/L a day`}</AppText>
              <AppText>{`= ${plainNumber(data.dose.ammoniumChlorideGPerDay)} g ammonium chloride a day`}</AppText>
              {data.dose.ammoniaSolutionMlPerDay !== null ? <AppText>{`or ${plainNumber(data.dose.ammoniaSolutionMlPerDay)} mL of your ammonia solution a day`}</AppText> : null}
            </View>
          ) : null}
          <AppText>{`Feeding: ${data.feeding.before} → ${data.feeding.after}`}</AppText>
          <Words lines={data.explanation} />
          <CautionsList extra={data.cautions} testID="removal-cautions" />
        </View>
      ) : null}
    </Section>
  );
}

function RescueAdvice({ tank, planId }: AdvicePanelProps) {
  const { space } = useTheme();
  const advice = useRescueAdvice(tank.id);
  const data = advice.data;
  return (
    <Section testID="advice-rescue">
      <AppText>If the saved plan's forecast spikes, which water changes keep it under the limits?</AppText>
      <Button label="Find rescue water changes" busy={advice.isPending} busyLabel="Working it out…" onPress={() => advice.mutate({ planId })} testID="advice-rescue-run" />
      {advice.isError ? <Banner tone="danger" title="No advice this time" message={errorText(advice.error)} /> : null}
      {data ? (
        <View testID="advice-rescue-result" style={{ gap: space.sm }}>
          <Heading level={3}>{data.status === 'no-changes-needed' ? 'No extra water changes needed' : data.status === 'rescued' ? 'These water changes keep it under' : 'Water changes alone cannot keep it under'}</Heading>
          {data.changes.map((c) => (
            <AppText key={c.day}>{`Day ${c.day}: change ${plainNumber(c.percent)} %`}</AppText>
          ))}
          <Words lines={data.explanation} />
          <CautionsList extra={data.cautions} />
        </View>
      ) : null}
    </Section>
  );
}

function CalibrationAdvice({ tank }: AdvicePanelProps) {
  const { space } = useTheme();
  const fit = useCalibration(tank.id);
  const data = fit.data;
  return (
    <Section testID="advice-calibration">
      <AppText>{`Fit the model to this tank's own ammonia and nitrite tests from ${fitWindowWords()}.`}</AppText>
      <Button label="Fit to my tests" busy={fit.isPending} busyLabel={fittingLabel(tank.readings, new Date())} onPress={() => fit.mutate({})} testID="advice-calibration-run" />
      {fit.isPending ? (
        <AppText tone="textMuted" accessibilityLiveRegion="polite" testID="calibration-progress">
          Trying filter strengths and growth speeds against your readings…
        </AppText>
      ) : null}
      {fit.isError ? <Banner tone="danger" title="Could not fit" message={errorText(fit.error)} testID="calibration-error" /> : null}
      {data ? (
        <View testID="advice-calibration-result" style={{ gap: space.sm }}>
          <Heading level={3}>{`Fit: ${data.quality.verdict} (${data.readingsUsed} tests)`}</Heading>
          <AppText>{`Ammonia your filter can clear now: about ${plainNumber(data.capacity.presentAoMgNPerDay)} mg N a day`}</AppText>
          <AppText>{`Nitrite your filter can clear now: about ${plainNumber(data.capacity.presentNoMgNPerDay)} mg N a day`}</AppText>
          <Words lines={data.explanation} />
          <CautionsList extra={data.cautions} />
        </View>
      ) : null}
    </Section>
  );
}

function CapacityTest({ tank }: AdvicePanelProps) {
  const { space } = useTheme();
  const test = useCapacityTest(tank.id);
  const data = test.data;
  return (
    <Section testID="advice-capacity-test">
      <AppText>No test history? The filter test: dose a measured pinch of ammonia, test the water four times over a day, and see how much ammonia your filter clears in a day.</AppText>
      <Button label="Show the filter test" busy={test.isPending} busyLabel="Preparing…" onPress={() => test.mutate({})} testID="advice-capacity-run" />
      {test.isError ? <Banner tone="danger" title="Could not prepare the test" message={errorText(test.error)} /> : null}
      {data ? (
        <View testID="advice-capacity-result" style={{ gap: space.sm }}>
          <Heading level={3}>{`Dose ${plainNumber(data.protocol.doseMgNPerL)} mg N/L, test at hours ${data.protocol.readingHours.join(', ')}`}</Heading>
          {data.protocol.steps.map((s, i) => (
            <AppText key={s}>{`${i + 1}. ${s}`}</AppText>
          ))}
          <AppText>{`Expected total ammonia at those hours: ${data.protocol.expectedTanMgN.map(plainNumber).join(', ')} mg N/L`}</AppText>
          <CautionsList extra={data.protocol.cautions} />
        </View>
      ) : null}
    </Section>
  );
}

/** Advice on the plan: how fast, rehoming with supplementary dosing, rescue water changes, calibration. */
export function AdvicePanel(props: AdvicePanelProps) {
  const { space, colors, radii, layout } = useTheme();
  const tab = useDraftStore((s) => s.adviceTab);
  const setTab = useDraftStore((s) => s.setAdviceTab);
  return (
    <View testID="advice-panel" style={{ gap: space.md }}>
      <Heading level={2}>Advice</Heading>
      <AppText variant="caption" tone="textMuted" testID="advice-filter-bacteria">{FILTER_BACTERIA_MEANING}</AppText>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.xs }} accessibilityRole="tablist">
        {TABS.map((t) => (
          <Pressable
            key={t.key}
            testID={`advice-tab-${t.key}`}
            accessibilityRole="tab"
            accessibilityState={{ selected: tab === t.key }}
            onPress={() => setTab(t.key)}
            style={{
              minHeight: layout.minTouchTarget,
              justifyContent: 'center',
              paddingHorizontal: space.md,
              borderRadius: radii.pill,
              borderWidth: tab === t.key ? 2 : 1,
              borderColor: tab === t.key ? colors.primary : colors.fieldBorder,
              backgroundColor: tab === t.key ? colors.navActiveSurface : colors.surface,
            }}
          >
            <AppText weight={tab === t.key ? 'bold' : 'regular'}>{t.label}</AppText>
          </Pressable>
        ))}
      </View>
      {tab === 'addition' ? <AdditionAdvice {...props} /> : null}
      {tab === 'removal' ? <RemovalAdvice {...props} /> : null}
      {tab === 'rescue' ? <RescueAdvice {...props} /> : null}
      {tab === 'calibration' ? <CalibrationAdvice {...props} /> : null}
      {tab === 'capacity-test' ? <CapacityTest {...props} /> : null}
    </View>
  );
}
