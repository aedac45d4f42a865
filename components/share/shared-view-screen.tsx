import { useMemo } from 'react';
import { View } from 'react-native';
import type { SharedView } from '@/shared/schemas/share';
import { forecastView } from '@/shared/forecast-view';
import { forecastParsed } from '@/simulation/forecast';
import { useSharedView } from '@/hooks/use-lessons';
import { useTheme } from '@/hooks/use-theme';
import { Screen } from '@/components/ui/screen';
import { Banner } from '@/components/ui/banner';
import { Card } from '@/components/ui/card';
import { BrandMark } from '@/components/ui/brand-mark';
import { AppText, Heading } from '@/components/ui/text';
import { Loading } from '@/components/ui/load-state';
import { ForecastChart } from '@/components/forecast/forecast-chart';
import { ForecastVerdict } from '@/components/forecast/forecast-verdict';
import { CautionsList } from '@/components/forecast/cautions-list';
import { LessonPlayer } from '@/components/lessons/lesson-player';
import { describeEventOnDay } from '@/components/plans/event-fields';

/** The page behind a read-only share link: no account, no navigation into anyone's data. */
export function SharedViewScreen({ token }: { token: string }) {
  const { space } = useTheme();
  const view = useSharedView(token);
  const title = view.data?.itemType === 'lesson' ? view.data.lesson.title : view.data?.itemType === 'plan' ? view.data.plan.name : 'Shared from Shoalshift';
  return (
    <Screen testID="screen-shared" title={title}>
      <BrandMark />
      <AppText tone="textMuted">A read-only view shared from Shoalshift.</AppText>
      {view.isPending ? <Loading label="Opening the link…" /> : null}
      {view.isError ? (
        <Banner tone="watch" title="This link does not work" message="It was revoked, has expired, or is mistyped. Ask the person who sent it for a new one." testID="shared-gone" />
      ) : null}
      {view.data?.itemType === 'lesson' ? (
        <>
          <View style={{ gap: space.xs }}>
            <Heading testID="shared-title">{view.data.lesson.title}</Heading>
            <AppText tone="textMuted">{`A lesson by ${view.data.lesson.authorName}`}</AppText>
            {view.data.lesson.summary ? <AppText>{view.data.lesson.summary}</AppText> : null}
          </View>
          <LessonPlayer lesson={view.data.lesson} />
        </>
      ) : null}
      {view.data?.itemType === 'plan' ? <SharedPlan view={view.data} /> : null}
    </Screen>
  );
}

function SharedPlan({ view }: { view: Extract<SharedView, { itemType: 'plan' }> }) {
  const { space } = useTheme();
  const chart = useMemo(() => {
    if (!view.scenario) return null;
    try {
      return forecastView(forecastParsed(view.scenario));
    } catch {
      return null;
    }
  }, [view.scenario]);
  return (
    <>
      <Heading testID="shared-title">{view.plan.name}</Heading>
      <Card testID="shared-plan-events" style={{ gap: space.xs }}>
        <Heading level={2}>{`The plan (day 0 = ${view.plan.startDate})`}</Heading>
        {view.plan.events.map((e, i) => (
          <AppText key={i}>{describeEventOnDay(e)}</AppText>
        ))}
      </Card>
      {chart ? (
        <Card style={{ gap: space.md }}>
          <Heading level={2}>Forecast</Heading>
          <ForecastVerdict view={chart} basis="N" testID="shared-summary" />
          <ForecastChart view={chart} basis="N" showBand={false} events={view.plan.events} testID="shared-chart" />
        </Card>
      ) : (
        <Banner tone="watch" title="No forecast for this plan" message="The plan could not be forecast as it stands." />
      )}
      <CautionsList testID="shared-cautions" />
    </>
  );
}
