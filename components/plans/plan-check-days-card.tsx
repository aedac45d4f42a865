import { View } from 'react-native';
import type { CheckDay } from '@/shared/schemas/plan';
import type { PlanCheckDay } from '@/shared/plan-check-days';
import type { NitrogenBasis } from '@/shared/schemas/preferences';
import { basisWords, formatNitrogen } from '@/lib/units-format';
import { CHECK_DAY_STATE_WORDS, type CheckDayProgress, type CheckDayState } from '@/lib/plan-progress';
import type { StatusTone } from '@/constants/theme';
import { useTheme } from '@/hooks/use-theme';
import { Card } from '@/components/ui/card';
import { StatusPill } from '@/components/ui/status-pill';
import { AppText, Heading } from '@/components/ui/text';

const STATE_TONE: Record<CheckDayState, StatusTone> = { done: 'ok', due: 'watch', missed: 'danger', upcoming: 'info', 'not-needed': 'info' };
/** A draft lists its first days; the printable plan has them all. */
const DRAFT_SHOWN = 12;

/**
 * When to test. A draft lists the days it will ask for; a started plan shows each day as
 * tested, due today, missed or still to come (lib/plan-progress.ts).
 */
export function PlanCheckDaysCard({ checkDays, progress, basis }: { checkDays: readonly (CheckDay | PlanCheckDay)[]; progress: readonly CheckDayProgress[] | null; basis: NitrogenBasis }) {
  const { space } = useTheme();
  // What the forecast says each test should show: the plan's one forecast, in the keeper's basis.
  const expected = new Map(checkDays.flatMap((d) => ('expected' in d && d.expected ? [[d.day, d.expected] as const] : [])));
  const expectWords = (day: number) => {
    const e = expected.get(day);
    return e ? `. The forecast says about ${formatNitrogen(e.tanMgN, 'tanMgN', basis)} ammonia and ${formatNitrogen(e.no2MgN, 'no2MgN', basis)} nitrite (${basisWords(basis)}).` : '';
  };
  return (
    <Card testID="plan-check-days">
      <Heading level={2}>When to test</Heading>
      {checkDays.length === 0 ? <AppText tone="textMuted">Add an event to see the test days.</AppText> : null}
      {progress ? (
        <View role="list" style={{ gap: space.xs }}>
          {progress.map((d) => (
            <View key={d.day} role="listitem" testID={`check-day-${d.day}`} style={{ flexDirection: 'row', gap: space.sm, alignItems: 'flex-start', flexWrap: 'wrap' }}>
              <StatusPill tone={STATE_TONE[d.state]} label={CHECK_DAY_STATE_WORDS[d.state]} testID={`check-day-${d.day}-state`} />
              <AppText style={{ flex: 1, minWidth: 200 }}>{`Day ${d.day} (${d.date}): ${d.reasons.join('; ')}${expectWords(d.day)}`}</AppText>
            </View>
          ))}
        </View>
      ) : (
        <>
          {checkDays.slice(0, DRAFT_SHOWN).map((d) => (
            <AppText key={d.day} testID={`check-day-${d.day}`}>{`Day ${d.day} (${d.date}): ${d.reasons.join('; ')}${expectWords(d.day)}`}</AppText>
          ))}
          {checkDays.length > DRAFT_SHOWN ? <AppText tone="textMuted">{`…and ${checkDays.length - DRAFT_SHOWN} more on the printable plan.`}</AppText> : null}
        </>
      )}
    </Card>
  );
}
