import { useMemo } from 'react';
import { View } from 'react-native';
import { createCommentSchema } from '@/shared/schemas/club';
import { forecastView } from '@/shared/forecast-view';
import { forecastParsed } from '@/simulation/forecast';
import { useAddComment, useClub, useSharedItem } from '@/hooks/use-clubs';
import { useFormState } from '@/hooks/use-form-state';
import { useTheme } from '@/hooks/use-theme';
import { usePreferences } from '@/hooks/use-preferences';
import { formErrorsFromRequest, NO_FORM_ERRORS, validateForm } from '@/lib/form-errors';
import { formatLitres, shortDate } from '@/lib/format';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Banner } from '@/components/ui/banner';
import { TextField } from '@/components/ui/text-field';
import { TextLink } from '@/components/ui/text-link';
import { AppText, Heading } from '@/components/ui/text';
import { Loading } from '@/components/ui/load-state';
import { ForecastChart } from '@/components/forecast/forecast-chart';
import { ForecastVerdict } from '@/components/forecast/forecast-verdict';
import { CautionsList } from '@/components/forecast/cautions-list';
import { describeEventOnDay } from '@/components/plans/event-fields';
import { LessonFromPlanCard } from '@/components/lessons/lesson-from-plan-card';
import { ROLE_LABEL } from './role-labels';

/** A tank or plan a member shared with the club, with mentors' comments on plans. */
export function SharedItemScreen({ clubId, shareId }: { clubId: string; shareId: string }) {
  const { space } = useTheme();
  const item = useSharedItem(clubId, shareId);
  const club = useClub(clubId);
  const prefs = usePreferences();
  const add = useAddComment(clubId, shareId);
  const { values, setValue, errors, setErrors } = useFormState({ body: '' });
  const chart = useMemo(() => {
    if (!item.data?.scenario) return null;
    try {
      return forecastView(forecastParsed(item.data.scenario));
    } catch {
      return null;
    }
  }, [item.data?.scenario]);
  const canComment = club.data?.myRole !== 'member' && item.data?.share.itemType === 'plan';
  const submit = () => {
    const checked = validateForm(createCommentSchema, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors(NO_FORM_ERRORS);
    add.mutate(checked.data.body, { onSuccess: () => setValue('body')(''), onError: (e) => setErrors(formErrorsFromRequest(e, ['body'])) });
  };
  const d = item.data;
  return (
    <Screen testID="screen-shared-item" title={d?.share.title ?? 'Shared item'}>
      <TextLink href={`/clubs/${clubId}`} label="← Back to the club" testID="shared-item-back" />
      {item.isPending ? <Loading label="Loading…" /> : null}
      {item.isError ? <Banner tone="watch" title="Not available" message="This item is not shared with you." testID="shared-item-missing" /> : null}
      {d ? (
        <>
          <View style={{ gap: space.xs }}>
            <Heading>{d.share.title}</Heading>
            <AppText tone="textMuted">{`${d.share.itemType === 'plan' ? 'Plan' : 'Tank'} shared by ${d.share.mine ? 'you' : d.share.ownerName}`}</AppText>
          </View>
          <Card style={{ gap: space.xs }}>
            <Heading level={2}>{d.tank.name}</Heading>
            <AppText>{`${formatLitres(d.tank.volumeL)} · ${d.tank.temperatureC} °C · pH ${d.tank.ph}`}</AppText>
            <AppText tone="textMuted">{`${d.tank.livestock.reduce((n, l) => n + l.count, 0)} animals · ${d.tank.readings.length} water tests`}</AppText>
          </Card>
          {d.plan ? (
            <Card style={{ gap: space.xs }} testID="shared-item-plan">
              <Heading level={2}>{`Plan from ${d.plan.startDate}`}</Heading>
              {d.plan.events.map((e, i) => (
                <AppText key={i}>{describeEventOnDay(e)}</AppText>
              ))}
            </Card>
          ) : null}
          {chart ? (
            <Card style={{ gap: space.md }}>
              <Heading level={2}>Forecast</Heading>
              <ForecastVerdict view={chart} basis={prefs.nitrogenBasis} testID="shared-item-summary" />
              <ForecastChart view={chart} basis={prefs.nitrogenBasis} showBand={false} events={d.plan?.events} testID="shared-item-chart" />
            </Card>
          ) : null}
          {d.share.itemType === 'plan' ? (
            <Card testID="shared-item-comments" style={{ gap: space.md }}>
              <Heading level={2}>Comments</Heading>
              {d.comments.length === 0 ? <AppText tone="textMuted">No comments yet.</AppText> : null}
              {d.comments.map((c) => (
                <View key={c.id} style={{ gap: space.xxs }}>
                  <AppText variant="caption" tone="textMuted">{`${c.authorName} (${ROLE_LABEL[c.authorRole]}) · ${shortDate(c.createdAt)}`}</AppText>
                  <AppText>{c.body}</AppText>
                </View>
              ))}
              {canComment ? (
                <>
                  {errors.banner ? <Banner tone="danger" title="Comment not saved" message={errors.banner} /> : null}
                  <TextField label="Your comment" testID="comment-body" value={values.body} onChangeText={setValue('body')} error={errors.fields.body} multiline />
                  <Button label="Post comment" onPress={submit} busy={add.isPending} testID="comment-submit" />
                </>
              ) : null}
            </Card>
          ) : null}
          {canComment && d.plan ? <LessonFromPlanCard clubId={clubId} shareId={shareId} planName={d.plan.name} /> : null}
          {chart ? <CautionsList /> : null}
        </>
      ) : null}
    </Screen>
  );
}
