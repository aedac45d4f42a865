import { useMemo, useState } from 'react';
import { View } from 'react-native';
import type { ScenarioInput } from '@/simulation/scenario';
import { ScenarioError } from '@/simulation/scenario';
import { forecastSentences, forecastView } from '@/shared/forecast-view';
import { forecast } from '@/simulation/forecast';
import { useTheme } from '@/hooks/use-theme';
import { Banner } from '@/components/ui/banner';
import { AppText } from '@/components/ui/text';
import { ForecastChart } from '@/components/forecast/forecast-chart';
import { ForecastVerdict } from '@/components/forecast/forecast-verdict';
import { ChoiceGroup } from '@/components/settings/choice-group';

export type PreviewInput = { ok: true; scenario: ScenarioInput; stagedScenario?: ScenarioInput } | { ok: false };

function run(scenario: ScenarioInput) {
  try {
    return { view: forecastView(forecast(scenario)), error: null };
  } catch (e) {
    if (e instanceof ScenarioError) return { view: null, error: Object.values(e.fields).join(' ') };
    return { view: null, error: e instanceof Error ? e.message : String(e) };
  }
}

/**
 * What the learner will see once they reveal the forecast, run here in the browser with the
 * same engine as the lesson page (as N, no uncertainty band). Recomputed as the form changes.
 */
export function LessonBuilderPreview({ input }: { input: PreviewInput }) {
  const { space } = useTheme();
  const [chart, setChart] = useState<'fast' | 'staged'>('fast');
  const runs = useMemo(() => {
    if (!input.ok) return null;
    return [
      { key: 'fast' as const, name: input.scenario.name ?? 'Forecast', r: run(input.scenario) },
      ...(input.stagedScenario ? [{ key: 'staged' as const, name: input.stagedScenario.name ?? 'Staged', r: run(input.stagedScenario) }] : []),
    ];
  }, [input]);

  if (!runs) {
    return <AppText tone="textMuted" testID="lesson-preview-waiting">The preview appears when the tank’s fields are filled in.</AppText>;
  }
  // A comparison: both forecasts in words, then one chart at a time (two sets of four panels
  // would push the second far out of view).
  const charted = runs.find((x) => x.key === chart) ?? runs[0];
  return (
    <View style={{ gap: space.md }} testID="lesson-preview">
      {runs.map(({ key, name, r }) => (
        <View key={key} style={{ gap: space.xs }} testID={`lesson-preview-${key}`}>
          {runs.length > 1 ? <AppText weight="bold">{name}</AppText> : null}
          {r.error ? <Banner tone="watch" title="This forecast cannot run yet" message={r.error} testID={`lesson-preview-${key}-error`} /> : null}
          {r.view ? <AppText testID={`lesson-preview-${key}-summary`}>{forecastSentences(r.view).slice(1).join(' ')}</AppText> : null}
        </View>
      ))}
      {runs.length > 1 ? (
        <ChoiceGroup
          label="Chart"
          testID="lesson-preview-which"
          value={charted.key}
          onChange={setChart}
          choices={runs.map((x) => ({ value: x.key, label: x.name }))}
        />
      ) : null}
      {charted.r.view ? (
        <>
          <ForecastVerdict view={charted.r.view} basis="N" compact testID={`lesson-preview-verdict-${charted.key}`} />
          <ForecastChart view={charted.r.view} basis="N" showBand={false} testID={`lesson-preview-chart-${charted.key}`} />
        </>
      ) : null}
    </View>
  );
}
