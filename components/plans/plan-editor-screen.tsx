import { useCallback, useEffect, useMemo } from 'react';
import { View } from 'react-native';
import type { ScenarioEvent } from '@/simulation/scenario';
import type { TankDetail } from '@/shared/schemas/tank';
import type { ScenarioTank } from '@/shared/tank-scenario';
import { planCheckDays } from '@/shared/plan-check-days';
import { START_SENTENCES } from '@/shared/forecast-view';
import { usePlan, usePlanForecast, useUpdatePlan } from '@/hooks/use-plans';
import { useTankDetail } from '@/hooks/use-tanks';
import { useLiveForecast } from '@/hooks/use-forecast';
import { usePreferences } from '@/hooks/use-preferences';
import { useLayoutSize } from '@/hooks/use-breakpoint';
import { useTheme } from '@/hooks/use-theme';
import { applySchedule, useDraftStore } from '@/lib/draft-store';
import { isApiRequestError } from '@/lib/api-client';
import { placedMessages } from '@/lib/form-errors';
import { basisWords } from '@/lib/units-format';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { ShareLinkPanel } from '@/components/share/share-link-panel';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { TextLink } from '@/components/ui/text-link';
import { StatusPill } from '@/components/ui/status-pill';
import { AppText, Heading } from '@/components/ui/text';
import { Loading, LoadError } from '@/components/ui/load-state';
import { ForecastChart } from '@/components/forecast/forecast-chart';
import { ForecastVerdict } from '@/components/forecast/forecast-verdict';
import { CautionsList } from '@/components/forecast/cautions-list';
import { planStatusLabel } from '@/components/tanks/tank-labels';
import { AdvicePanel } from '@/components/plans/advice-panel';
import { CountSlider } from '@/components/plans/count-slider';
import { EventForm } from '@/components/plans/event-form';
import { EventTimeline } from '@/components/plans/event-timeline';

const NO_EVENTS: ScenarioEvent[] = [];

/** What the scenario builder needs of the tank page's data. */
export function scenarioTankOf(tank: TankDetail): ScenarioTank {
  return {
    volumeL: tank.volumeL,
    temperatureC: tank.temperatureC,
    ph: tank.ph,
    khDkh: tank.khDkh,
    tapWater: tank.tapWater,
    setup: tank.setup,
    livestock: tank.livestock,
    readings: tank.readings,
  };
}

/** Index of the add-fish event the slider moves: the selected one, else the first. */
function sliderTarget(events: readonly ScenarioEvent[], selected: number | null): number {
  if (selected !== null && events[selected]?.type === 'add-fish') return selected;
  return events.findIndex((e) => e.type === 'add-fish');
}

/** A plan: its timeline of events, the live forecast while editing, advice, and saving. */
export function PlanEditorScreen({ id }: { id: string }) {
  const plan = usePlan(id);
  const tank = useTankDetail(plan.data?.tankId ?? '');
  const title = plan.data?.name ?? 'Plan';
  return (
    <Screen testID="screen-plan" title={title}>
      <TextLink href="/plans" label="← All plans" testID="plan-back" />
      {plan.isPending || (plan.data && tank.isPending) ? <Loading label="Loading the plan…" /> : null}
      {plan.isError && isApiRequestError(plan.error) && plan.error.status === 404 ? (
        <Banner tone="watch" title="Plan not found" message="This plan does not exist, or it belongs to someone else." testID="plan-not-found" />
      ) : plan.isError ? (
        <LoadError title="Could not load the plan" error={plan.error} onRetry={() => void plan.refetch()} retrying={plan.isFetching} />
      ) : null}
      {tank.isError ? <LoadError title="Could not load the tank" error={tank.error} onRetry={() => void tank.refetch()} retrying={tank.isFetching} /> : null}
      {plan.data && tank.data ? <Editor planId={id} tank={tank.data} /> : null}
    </Screen>
  );
}

function Editor({ planId, tank }: { planId: string; tank: TankDetail }) {
  const { space } = useTheme();
  const size = useLayoutSize();
  const prefs = usePreferences();
  const saved = usePlan(planId).data!;
  const save = useUpdatePlan(planId);
  const server = usePlanForecast(planId, saved.updatedAt);

  const draft = useDraftStore((s) => s.drafts[planId]);
  const selected = useDraftStore((s) => s.selected[planId] ?? null);
  const { ensureDraft, setEvents, updateEvent, addEvent, removeEvent, setName, select, markSaved, discard } = useDraftStore.getState();
  useEffect(() => ensureDraft(planId, saved), [planId, saved, ensureDraft]);

  const events = draft?.events ?? NO_EVENTS;
  const dirty = draft?.dirty ?? false;
  const sTank = useMemo(() => scenarioTankOf(tank), [tank]);
  const live = useLiveForecast(sTank, draft ? events : undefined);

  // The saved plan's server forecast (with its band) until the draft changes; then the live one.
  const shownFromServer = !dirty && server.data !== undefined;
  const view = shownFromServer ? server.data!.forecast : live.view;
  const checkDays = useMemo(() => planCheckDays(events, saved.startDate), [events, saved.startDate]);

  const target = sliderTarget(events, selected);
  const targetEvent = target >= 0 ? (events[target] as Extract<ScenarioEvent, { type: 'add-fish' }>) : null;
  // The slider's range follows the saved plan, so it does not stretch while a finger drags it.
  const sliderMax = useMemo(
    () => Math.max(60, ...saved.events.map((e) => (e.type === 'add-fish' ? 2 * e.fish.count : 0)), targetEvent?.fish.count ?? 0),
    [saved.events, targetEvent?.fish.count],
  );
  const onSlide = useCallback(
    (count: number) => {
      const e = useDraftStore.getState().drafts[planId]?.events[target];
      if (e?.type === 'add-fish') updateEvent(planId, target, { ...e, fish: { ...e.fish, count } });
    },
    [planId, target, updateEvent],
  );

  const onSave = () =>
    save.mutate(
      { name: draft?.name ?? saved.name, events },
      { onSuccess: (p) => markSaved(planId, p.updatedAt) },
    );
  const saveErrors = save.error && isApiRequestError(save.error) ? save.error.fields : {};

  const headerCard = (
      <Card testID="plan-header">
        <View style={{ flexDirection: 'row', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm }}>
          <Heading testID="plan-name">{draft?.name ?? saved.name}</Heading>
          <StatusPill tone={planStatusLabel[saved.status].tone} label={planStatusLabel[saved.status].label} testID="plan-status" />
        </View>
        <AppText tone="textMuted">{`${saved.tankName} · starts ${saved.startDate}`}</AppText>
        <TextLink href={`/tanks/${saved.tankId}`} label="Open the tank" testID="plan-tank-link" />
        <TextLink href={`/print/plan/${planId}`} label="Printable plan" testID="plan-print-link" />
      </Card>
  );
  const sliderCard = targetEvent ? (
        <Card testID="plan-slider-card">
          <CountSlider
            label={`Fish added on day ${targetEvent.day}`}
            value={targetEvent.fish.count}
            min={1}
            max={sliderMax}
            onChange={onSlide}
            testID="fish-count-slider"
          />
          <AppText variant="caption" tone="textMuted">The forecast redraws as you move it; save to keep the change.</AppText>
        </Card>
  ) : null;
  const planColumn = (
    <View style={{ gap: space.lg, flex: 1, minWidth: 0 }}>
      <Card testID="plan-events">
        <Heading level={2}>What happens when</Heading>
        <EventTimeline events={events} startDate={saved.startDate} selected={selected} onSelect={(i) => select(planId, i)} onRemove={(i) => { select(planId, null); removeEvent(planId, i); }} />
        <Heading level={3}>{selected !== null && events[selected] ? `Edit day ${events[selected].day}` : 'Add an event'}</Heading>
        <EventForm
          editing={selected !== null ? events[selected] ?? null : null}
          onSubmit={(e) => (selected !== null ? updateEvent(planId, selected, e) : addEvent(planId, e))}
          onCancel={selected !== null ? () => select(planId, null) : undefined}
        />
      </Card>

      <Card testID="plan-save">
        <TextField label="Plan name" value={draft?.name ?? saved.name} onChangeText={(v) => setName(planId, v)} error={saveErrors.name} testID="plan-name-field" />
        {save.isError ? (
          <Banner tone="danger" title="Not saved" message={Object.entries(saveErrors).map(([k, v]) => `${k}: ${v}`).join(' ') || save.error.message} testID="plan-save-error" />
        ) : null}
        {save.isSuccess && !dirty ? <Banner tone="ok" title="Saved" message="The forecast now comes from the server, with its uncertainty band." testID="plan-saved" /> : null}
        <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
          <Button label="Save plan" onPress={onSave} busy={save.isPending} busyLabel="Saving…" disabled={!dirty} testID="plan-save-button" />
          {dirty ? <Button label="Undo changes" variant="secondary" onPress={() => { discard(planId); ensureDraft(planId, saved); }} testID="plan-discard" /> : null}
        </View>
      </Card>

      <Card testID="plan-check-days">
        <Heading level={2}>When to test</Heading>
        {checkDays.length === 0 ? <AppText tone="textMuted">Add an event to see the test days.</AppText> : null}
        {checkDays.slice(0, 12).map((d) => (
          <AppText key={d.day}>{`Day ${d.day} (${d.date}): ${d.reasons.join('; ')}`}</AppText>
        ))}
        {checkDays.length > 12 ? <AppText tone="textMuted">{`…and ${checkDays.length - 12} more on the printable plan.`}</AppText> : null}
      </Card>
    </View>
  );

  // The verdict first, then the chart; what the chart draws and where it starts from below it.
  const forecastCard = (
      <Card testID="plan-forecast">
        <Heading level={2}>Forecast</Heading>
        {live.fields && !shownFromServer ? (
          <Banner tone="watch" title="The forecast cannot run yet" message={placedMessages(live.fields)} testID="forecast-refused" />
        ) : null}
        {server.isError && !dirty ? <Banner tone="watch" title="No saved forecast" message={server.error.message} testID="forecast-server-error" /> : null}
        {view ? (
          <>
            <ForecastVerdict view={view} basis={prefs.nitrogenBasis} />
            <ForecastChart view={view} basis={prefs.nitrogenBasis} showBand={shownFromServer} events={events} />
          </>
        ) : (
          <Loading label="Running the forecast…" testID="forecast-loading" />
        )}
        <AppText variant="caption" tone="textMuted" testID="forecast-source">
          {shownFromServer
            ? `Saved plan. Shaded: where 8 in 10 likely forecasts fall. Ammonia, nitrite and nitrate ${basisWords(prefs.nitrogenBasis)}.`
            : `Live forecast of your unsaved changes (no shading until you save). Ammonia, nitrite and nitrate ${basisWords(prefs.nitrogenBasis)}.`}
        </AppText>
        {shownFromServer ? <AppText variant="caption" tone="textMuted" testID="forecast-start">{START_SENTENCES[server.data!.startReason]}</AppText> : null}
      </Card>
  );
  const adviceCard = (
      <Card>
        <AdvicePanel
          tank={tank}
          planId={planId}
          events={events}
          onApplySchedule={(schedule) => {
            select(planId, null);
            setEvents(planId, applySchedule(useDraftStore.getState().drafts[planId]?.events ?? events, schedule));
          }}
        />
      </Card>
  );
  const cautions = <CautionsList extra={shownFromServer ? server.data!.cautions : []} testID="plan-cautions" />;
  // A link shows the saved plan (not unsaved changes) to someone without an account.
  const shareCard = <ShareLinkPanel itemType="plan" itemId={planId} />;

  // Wide: the plan beside its forecast. Phone: the forecast first, then the plan, then advice.
  return size === 'wide' ? (
    <View style={{ flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' }} testID="plan-wide">
      <View style={{ gap: space.lg, flex: 1, minWidth: 0 }}>
        {headerCard}
        {sliderCard}
        {planColumn}
      </View>
      <View style={{ gap: space.lg, flex: 1, minWidth: 0 }}>
        {forecastCard}
        {adviceCard}
        {cautions}
        {shareCard}
      </View>
    </View>
  ) : (
    <View style={{ gap: space.lg }} testID="plan-narrow">
      {headerCard}
      {sliderCard}
      {forecastCard}
      {planColumn}
      {adviceCard}
      {cautions}
      {shareCard}
    </View>
  );
}
