import { useMemo, useState } from 'react';
import { View } from 'react-native';
import type { LessonContent } from '@/shared/schemas/lesson';
import type { Scenario } from '@/simulation/scenario';
import { forecastView } from '@/shared/forecast-view';
import { forecastParsed } from '@/simulation/forecast';
import { NITRITE_PRACTICE_LIMIT_MG_N } from '@/simulation/limits';
import { peakOf } from '@/simulation/series-stats';
import { useTheme } from '@/hooks/use-theme';
import { useLayoutSize } from '@/hooks/use-breakpoint';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { AppText, Heading } from '@/components/ui/text';
import { ForecastChart } from '@/components/forecast/forecast-chart';
import { ForecastVerdict } from '@/components/forecast/forecast-verdict';
import { CautionsList } from '@/components/forecast/cautions-list';
import { GuessChart } from './guess-chart';
import { scoreGuess, shortValue, type PeakPoint } from './guess-score';

/** Forecast length when a scenario gives none (simulation/forecast/options.ts default). */
const DEFAULT_HORIZON_DAYS = 60;

/** Days over the nitrite limit in words; the engine gives fractions of a day. */
function overLimitText(days: number): string {
  if (days <= 0) return 'never over the limit';
  const whole = Math.max(1, Math.round(days));
  return `about ${whole} day${whole === 1 ? '' : 's'} over the limit`;
}

function runForecast(scenario: Scenario) {
  const f = forecastParsed(scenario);
  return { view: forecastView(f), no2Peak: peakOf(f.series.days, f.series.no2MgN), days: f.series.days, no2MgN: f.series.no2MgN };
}

/**
 * A lesson as a newcomer meets it: the narrative, a guess of the nitrite peak on an empty chart,
 * then the forecast (run here in the browser) and how close the guess was. A comparison shows
 * the fast and the staged forecast side by side.
 */
export function LessonPlayer({ lesson }: { lesson: LessonContent }) {
  const { space } = useTheme();
  const wide = useLayoutSize() !== 'phone';
  const horizon = lesson.scenario.horizonDays ?? DEFAULT_HORIZON_DAYS;
  const [guess, setGuess] = useState<PeakPoint>({ day: Math.round(horizon / 4), value: 0.3 });
  const [revealed, setRevealed] = useState(false);

  const outcome = useMemo(() => {
    if (!revealed) return null;
    try {
      return { result: { fast: runForecast(lesson.scenario), staged: lesson.stagedScenario ? runForecast(lesson.stagedScenario) : null }, error: null };
    } catch (e) {
      return { result: null, error: e instanceof Error ? e.message : String(e) };
    }
  }, [revealed, lesson]);
  const result = outcome?.result ?? null;
  const error = outcome?.error ?? null;
  const score = result && result.fast.no2Peak.value > 0 ? scoreGuess(guess, result.fast.no2Peak) : null;

  return (
    <View style={{ gap: space.lg }}>
      <Card testID="lesson-steps" style={{ gap: space.md }}>
        <Heading level={2}>The story</Heading>
        {lesson.steps.map((s, i) => (
          <View key={`${i}-${s.title}`} style={{ gap: space.xxs }} testID={`lesson-step-${i}`}>
            <AppText weight="bold">{`${i + 1}. ${s.title}`}</AppText>
            <AppText>{s.body}</AppText>
          </View>
        ))}
      </Card>

      <Card testID="lesson-guess" style={{ gap: space.md }}>
        <Heading level={2}>{revealed ? 'Your guess and the forecast' : 'Your guess'}</Heading>
        {!revealed ? (
          <AppText>
            {`Where will nitrite peak${lesson.kind === 'compare' ? ` in “${lesson.scenario.name ?? 'the fast way'}”` : ''}? Drag the dot to the day and height you expect, then show the forecast.`}
          </AppText>
        ) : null}
        <GuessChart
          horizonDays={horizon}
          limitMgN={NITRITE_PRACTICE_LIMIT_MG_N}
          guess={guess}
          onGuess={revealed ? undefined : setGuess}
          revealed={result ? { days: result.fast.days, no2MgN: result.fast.no2MgN, peak: result.fast.no2Peak } : undefined}
        />
        <AppText weight="bold" testID="lesson-guess-value">{`Your guess: day ${guess.day}, ${shortValue(guess.value)} mg/L nitrite as N`}</AppText>
        {!revealed ? <Button label="Show the forecast" onPress={() => setRevealed(true)} testID="lesson-reveal" /> : null}
        {error ? <Banner tone="danger" title="This lesson's scenario could not be forecast" message={error} testID="lesson-error" /> : null}
        {result && score ? (
          <Banner tone={score.closeness === 'close' ? 'ok' : score.closeness === 'near' ? 'info' : 'watch'} title={score.headline} testID="lesson-score">
            <AppText>{`Forecast peak: day ${result.fast.no2Peak.day}, ${shortValue(result.fast.no2Peak.value)} mg/L. ${score.detail}`}</AppText>
          </Banner>
        ) : null}
        {result && !score ? <Banner tone="ok" title="No nitrite rise in this forecast" testID="lesson-score" /> : null}
      </Card>

      {result ? (
        <View style={{ flexDirection: wide && result.staged ? 'row' : 'column', gap: space.lg }} testID="lesson-forecasts">
          {[
            { key: 'fast', scenario: lesson.scenario, r: result.fast },
            ...(result.staged && lesson.stagedScenario ? [{ key: 'staged', scenario: lesson.stagedScenario, r: result.staged }] : []),
          ].map(({ key, scenario, r }) => (
            <Card key={key} testID={`lesson-forecast-${key}`} style={{ gap: space.md, flex: wide && result.staged ? 1 : undefined, minWidth: 0 }}>
              <Heading level={2}>{scenario.name ?? 'Forecast'}</Heading>
              <AppText testID={`lesson-peak-${key}`}>{`Nitrite peaks on day ${r.no2Peak.day} at ${shortValue(r.no2Peak.value)} mg/L as N; ${overLimitText(r.view.daysOver.no2.days)}.`}</AppText>
              <ForecastVerdict view={r.view} basis="N" compact testID={`lesson-summary-${key}`} />
              <ForecastChart view={r.view} basis="N" showBand={false} events={scenario.events} testID={`lesson-chart-${key}`} />
            </Card>
          ))}
        </View>
      ) : null}
      {result ? <CautionsList testID="lesson-cautions" /> : null}
    </View>
  );
}
