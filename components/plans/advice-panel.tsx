import { useState } from 'react';
import { Pressable, View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { useCalibration, useCapacityTest, useRemovalAdvice, useRescueAdvice } from '@/hooks/use-plans';
import { useDraftStore, type AdviceTab } from '@/lib/draft-store';
import { parseDecimal } from '@/lib/units-format';
import { fitWindowWords, fittingLabel } from '@/lib/calibration-progress';
import { plainNumber } from '@/shared/forecast-view';
import { AppText, Heading } from '@/components/ui/text';
import { Button } from '@/components/ui/button';
import { Banner } from '@/components/ui/banner';
import { TextField } from '@/components/ui/text-field';
import { CautionsList } from '@/components/forecast/cautions-list';
import { speciesDisplayName } from '@/components/tanks/tank-labels';
import { errorText, Section, Words, type AdvicePanelProps } from '@/components/plans/advice-parts';
import { AdditionAdvice } from '@/components/plans/addition-advice';

export type { AdvicePanelProps } from '@/components/plans/advice-parts';

const TABS: { key: AdviceTab; label: string }[] = [
  { key: 'addition', label: 'How fast' },
  { key: 'removal', label: 'Rehoming' },
  { key: 'rescue', label: 'Rescue' },
  { key: 'calibration', label: 'Fit to my tests' },
  { key: 'capacity-test', label: 'Capacity test' },
];

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
          <AppText>{`Ammonia-eating capacity now: about ${plainNumber(data.capacity.presentAoMgNPerDay)} mg N a day`}</AppText>
          <AppText>{`Nitrite-eating capacity now: about ${plainNumber(data.capacity.presentNoMgNPerDay)} mg N a day`}</AppText>
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
      <AppText>No test history? A guided test measures how much ammonia the biofilter clears in a day.</AppText>
      <Button label="Show the test" busy={test.isPending} busyLabel="Preparing…" onPress={() => test.mutate({})} testID="advice-capacity-run" />
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
