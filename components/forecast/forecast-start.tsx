import { View } from 'react-native';
import { useTheme } from '@/hooks/use-theme';
import { startLine, startWarningLines } from '@/shared/start-words';
import type { FitBand } from '@/shared/schemas/plan';
import type { NitrogenBasis } from '@/shared/schemas/preferences';
import type { StartState } from '@/shared/schemas/start-state';
import { describeBandChange } from '@/simulation/advice/calibration';
import { AppText } from '@/components/ui/text';
import { Banner } from '@/components/ui/banner';

/** What a forecast started from, in one line in the keeper's basis; its warnings; and, with a fit, how much it narrowed the band. */
export function ForecastStart({ state, basis, fitBand = null }: { state: StartState; basis: NitrogenBasis; fitBand?: FitBand | null }) {
  const { space } = useTheme();
  const warnings = startWarningLines(state, basis);
  return (
    <View style={{ gap: space.xs }}>
      <AppText variant="caption" tone="textMuted" testID="forecast-start">
        {startLine(state, basis)}
      </AppText>
      {fitBand ? (
        <AppText variant="caption" tone="textMuted" testID="forecast-fit-band">
          {describeBandChange(fitBand.tanMgN, fitBand.no2MgN)}
        </AppText>
      ) : null}
      {warnings.length > 0 ? (
        <Banner tone="watch" title="Check where this forecast starts" testID="forecast-start-warnings">
          {warnings.map((w) => (
            <AppText key={w}>{w}</AppText>
          ))}
        </Banner>
      ) : null}
    </View>
  );
}
