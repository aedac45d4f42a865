import { View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { useApplyFit, useCalibration, useClearFit } from '@/hooks/use-tank-fit';
import { requestErrorLine } from '@/lib/form-errors';
import { fitWindowWords, fittingLabel } from '@/lib/calibration-progress';
import { shortDate } from '@/lib/format';
import { plainNumber } from '@/shared/forecast-view';
import type { TankDetail } from '@/shared/schemas/tank';
import { AppText, Heading } from '@/components/ui/text';
import { Button } from '@/components/ui/button';
import { Banner } from '@/components/ui/banner';
import { CautionsList } from '@/components/forecast/cautions-list';

/**
 * "Fit to my tests" on the tank page and the plan page: runs the fit on the tank's own tests,
 * says how good it is and why, and applies it with one tap (every later forecast of the tank
 * then starts from its capacities); the applied fit can be dropped again.
 */
export function FitToTests({ tank }: { tank: TankDetail }) {
  const { space } = useTheme();
  const fit = useCalibration(tank.id);
  const apply = useApplyFit(tank.id);
  const clear = useClearFit(tank.id);
  const data = fit.data;
  const applied = tank.fit;
  const thisOneApplied = data !== undefined && applied?.id === data.fit.id;
  return (
    <View style={{ gap: space.sm }} testID="fit-to-tests">
      {applied ? (
        <Banner
          tone="ok"
          title="Forecasts start from your fit"
          message={`Fitted on ${shortDate(applied.fittedAt)} to ${applied.readingsUsed} tests (${applied.verdict} fit). Every forecast of this tank starts from it, after your latest test's water.`}
          testID="fit-applied"
        >
          <Button variant="secondary" label="Stop using the fit" busy={clear.isPending} busyLabel="Stopping…" onPress={() => clear.mutate()} testID="fit-clear" />
        </Banner>
      ) : null}
      <AppText>{`Fit the model to this tank's own ammonia and nitrite tests from ${fitWindowWords()}.`}</AppText>
      <Button label="Fit to my tests" busy={fit.isPending} busyLabel={fittingLabel(tank.readings, new Date())} onPress={() => fit.mutate({})} testID="advice-calibration-run" />
      {fit.isPending ? (
        <AppText tone="textMuted" accessibilityLiveRegion="polite" testID="calibration-progress">
          Trying filter strengths and growth speeds against your readings…
        </AppText>
      ) : null}
      {fit.isError ? <Banner tone="danger" title="Could not fit" message={requestErrorLine(fit.error)} testID="calibration-error" /> : null}
      {data ? (
        <View testID="advice-calibration-result" style={{ gap: space.sm }}>
          <Heading level={3}>{`Fit: ${data.quality.verdict} (${data.readingsUsed} tests)`}</Heading>
          <AppText>{`Ammonia-eating capacity now: about ${plainNumber(data.capacity.presentAoMgNPerDay)} mg N a day`}</AppText>
          <AppText>{`Nitrite-eating capacity now: about ${plainNumber(data.capacity.presentNoMgNPerDay)} mg N a day`}</AppText>
          {data.explanation.map((l) => (
            <AppText key={l}>{l}</AppText>
          ))}
          {data.advice.length > 0 ? (
            <Banner tone="watch" title={data.quality.verdict === 'good' ? 'What would pin it down' : `Why the fit is ${data.quality.verdict}, and what would help`} testID="fit-advice">
              {data.advice.map((l) => (
                <AppText key={l}>{l}</AppText>
              ))}
            </Banner>
          ) : null}
          {thisOneApplied ? (
            <AppText tone="textMuted" testID="fit-apply-done">Applied: the next forecasts start from this fit.</AppText>
          ) : (
            <Button label="Use this fit for every forecast" busy={apply.isPending} busyLabel="Applying…" onPress={() => apply.mutate(data.fit.id)} testID="fit-apply" />
          )}
          {apply.isError ? <Banner tone="danger" title="Not applied" message={requestErrorLine(apply.error)} testID="fit-apply-error" /> : null}
          <CautionsList extra={data.cautions} />
        </View>
      ) : null}
    </View>
  );
}
