import { useState } from 'react';
import { Pressable, View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { useCapacityTest, useRemovalAdvice, useRescueAdvice } from '@/hooks/use-plans';
import { useDraftStore, type AdviceTab } from '@/lib/draft-store';
import { requestErrorLine } from '@/lib/form-errors';
import { parseDecimal } from '@/lib/units-format';
import { plainNumber } from '@/shared/forecast-view';
import type { ScenarioEvent } from '@/simulation/scenario';
import type { TankDetail } from '@/shared/schemas/tank';
import type { planOutcomeSchema } from '@/simulation/advice/schemas';
import { FILTER_BACTERIA_MEANING } from '@/simulation/advice/explain';
import { AppText, Heading } from '@/components/ui/text';
import { Button } from '@/components/ui/button';
import { Banner } from '@/components/ui/banner';
import { TextField } from '@/components/ui/text-field';
import { CautionsList } from '@/components/forecast/cautions-list';
import { FitToTests } from '@/components/tanks/fit-to-tests';
import { speciesDisplayName } from '@/components/tanks/tank-labels';
import { fishName } from '@/components/plans/fish-groups';
import { errorText, Section, Words, type AdvicePanelProps } from '@/components/plans/advice-parts';
import { AdditionAdvice } from '@/components/plans/addition-advice';

export type { AdvicePanelProps } from '@/components/plans/advice-parts';

const TABS: { key: AdviceTab; label: string }[] = [
  { key: 'addition', label: 'How fast' },
  { key: 'removal', label: 'Rehoming' },
  { key: 'rescue', label: 'Rescue' },
  { key: 'calibration', label: 'Fit to my tests' },
  { key: 'capacity-test', label: 'Filter test' },
];

type RemovalAnswer = NonNullable<ReturnType<typeof useRemovalAdvice>['data']>;

function removalHeading(data: RemovalAnswer): string {
  if (data.dose.mgNPerLPerDay === 0) return 'No dosing needed';
  const d = data.delivery;
  if (d.method === 'split') return `Dose ammonia ${d.timesPerDay} times a day until the restock`;
  if (d.method === 'continuous') return 'Dose ammonia continuously until the restock';
  return 'Dose ammonia daily until the restock';
}

/** How the day's dose goes in, with each part's amount. */
function deliveryLine(data: RemovalAnswer): string {
  const d = data.delivery;
  if (d.method === 'continuous') return 'Spread evenly over each day with a dosing pump or a drip.';
  if (d.method === 'once-a-day' || !d.perDose) return 'All at once, once a day.';
  const ml = d.perDose.ammoniaSolutionMl !== null ? ` or ${plainNumber(d.perDose.ammoniaSolutionMl)} mL` : '';
  return `In ${d.timesPerDay} equal doses, ${plainNumber(24 / (d.timesPerDay ?? 1))} hours apart: ${plainNumber(d.perDose.mgNPerL)} mg N/L each (${plainNumber(d.perDose.ammoniumChlorideG)} g ammonium chloride${ml}).`;
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
      {advice.isError ? <Banner tone="danger" title="No advice this time" message={requestErrorLine(advice.error)} /> : null}
      {data ? (
        <View testID="advice-removal-result" style={{ gap: space.sm }}>
          <Heading level={3}>{removalHeading(data)}</Heading>
          {data.dose.mgNPerLPerDay > 0 ? (
            <View testID="removal-dose">
              <AppText>{`${plainNumber(data.dose.mgNPerLPerDay)} mg N/L a day`}</AppText>
              <AppText>{`= ${plainNumber(data.dose.ammoniumChlorideGPerDay)} g ammonium chloride a day`}</AppText>
              {data.dose.ammoniaSolutionMlPerDay !== null ? <AppText>{`or ${plainNumber(data.dose.ammoniaSolutionMlPerDay)} mL of your ammonia solution a day`}</AppText> : null}
              <AppText weight="bold" testID="removal-delivery">{deliveryLine(data)}</AppText>
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
      {advice.isError ? <Banner tone="danger" title="No advice this time" message={requestErrorLine(advice.error)} /> : null}
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
  return (
    <Section testID="advice-calibration">
      <FitToTests tank={tank} />
    </Section>
  );
}

function CapacityTest({ tank }: AdvicePanelProps) {
  const { space } = useTheme();
  const test = useCapacityTest(tank.id);
  const data = test.data;
  return (
    <Section testID="advice-capacity-test">
      <AppText>No test history? A guided test measures how much ammonia the biofilter clears in a day.</AppText>
      <Button label="Show the test" busy={test.isPending} busyLabel="Preparing…" onPress={() => test.mutate({})} testID="advice-capacity-run" />
      {test.isError ? <Banner tone="danger" title="Could not prepare the test" message={requestErrorLine(test.error)} /> : null}
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
