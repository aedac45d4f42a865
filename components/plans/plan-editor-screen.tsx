import { useCallback, useEffect, useMemo } from 'react';
import { View } from 'react-native';
import type { ScenarioEvent } from '@/simulation/scenario';
import type { TankDetail } from '@/shared/schemas/tank';
import type { ScenarioTank } from '@/shared/tank-scenario';
import { planCheckDays } from '@/shared/plan-check-days';
import { defaultHorizonDays } from '@/shared/tank-scenario';
import { usePlan, usePlanForecast, usePlanReadings, useUpdatePlan } from '@/hooks/use-plans';
import { useTankDetail } from '@/hooks/use-tanks';
import { useLiveForecast } from '@/hooks/use-forecast';
import { planForecastVersion } from '@/lib/query-keys';
import { usePreferences } from '@/hooks/use-preferences';
import { useLayoutSize } from '@/hooks/use-breakpoint';
import { useTheme } from '@/hooks/use-theme';
import { applySchedule, eventCount, useDraftStore } from '@/lib/draft-store';
import { isApiRequestError } from '@/lib/api-client';
import { basisWords, formatVolume } from '@/lib/units-format';
import { livestockFish } from '@/components/tanks/livestock-stocking';
import { planProgress, readingDay, readingsBesideForecast } from '@/lib/plan-progress';
import { describeEvent } from '@/components/plans/event-fields';
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
import { ForecastStart } from '@/components/forecast/forecast-start';
import { CautionsList } from '@/components/forecast/cautions-list';
import { planStatusLabel } from '@/components/tanks/tank-labels';
import { AdvicePanel } from '@/components/plans/advice-panel';
import { CountSlider } from '@/components/plans/count-slider';
import { EventForm, type StockingContext } from '@/components/plans/event-form';
import { fishOnDay } from '@/shared/fish-on-day';
import { fishName } from '@/components/plans/fish-groups';
import { planErrors } from '@/components/plans/plan-errors';
import { EventTimeline } from '@/components/plans/event-timeline';
import { PlanLifeCard } from '@/components/plans/plan-life-card';
import { PlanCheckDaysCard } from '@/components/plans/plan-check-days-card';
import { ReadingsBesideForecast } from '@/components/plans/readings-beside-forecast';

const NO_EVENTS: ScenarioEvent[] = [];
const NO_FIELDS: Record<string, string> = {};

/** What the scenario builder needs of the tank page's data. */
export function scenarioTankOf(tank: TankDetail): ScenarioTank {
  return {
    volumeL: tank.volumeL,
    temperatureC: tank.temperatureC,
    ph: tank.ph,
    khDkh: tank.khDkh,
    tapWater: tank.tapWater,
    setup: tank.setup,
    history: tank.history,
    fit: tank.fit,
    livestock: tank.livestock,
    readings: tank.readings,
  };
}

/** Index of the add-fish event the slider moves: the selected one, else the first. */
function sliderTarget(events: readonly ScenarioEvent[], selected: number | null): number {
  if (selected !== null && events[selected]?.type === 'add-fish') return selected;
  return events.findIndex((e) => e.type === 'add-fish');
}

/**
 * A plan: its timeline of events, the live forecast while editing, advice, and saving; once
 * started, its test days and the tank's tests beside the forecast; once done, all read-only.
 */
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
  const server = usePlanForecast(planId, planForecastVersion(saved.updatedAt, tank));

  const draft = useDraftStore((s) => s.drafts[planId]);
  const selected = useDraftStore((s) => s.selected[planId] ?? null);
  const { ensureDraft, setEvents, updateEvent, addEvent, removeEvent, setName, select, markSaved, discard } = useDraftStore.getState();
  useEffect(() => ensureDraft(planId, saved), [planId, saved, ensureDraft]);

  // A finished plan shows what it ran, never a leftover unsaved draft.
  const finished = saved.status === 'done';
  const events = finished ? saved.events : (draft?.events ?? NO_EVENTS);
  const dirty = !finished && (draft?.dirty ?? false);
  const sTank = useMemo(() => scenarioTankOf(tank), [tank]);
  const tankFish = tank.livestock.reduce((n, l) => n + l.count, 0);
  const live = useLiveForecast(sTank, draft ? events : undefined, saved.startDate);

  // The saved plan's server forecast (with its band) until the draft changes; then the live one.
  const shownFromServer = !dirty && server.data !== undefined;
  const view = shownFromServer ? server.data!.forecast : live.view;
  const checkDays = useMemo(() => planCheckDays(events, saved.startDate, view ?? undefined), [events, saved.startDate, view]);
  const readOnly = finished;
  const planReadings = usePlanReadings(saved);
  // The server sends every test that could be day 0 somewhere; keep those of this calendar.
  const readings = useMemo(() => planReadings.data?.readings.filter((r) => readingDay(r.takenAt, saved.startDate) >= 0), [planReadings.data, saved.startDate]);
  // Where a started plan stands, against its saved check days and the tests since day 0.
  const progress = useMemo(
    () => (saved.status === 'draft' ? null : planProgress(saved, readings ?? [], new Date(), defaultHorizonDays(saved.events))),
    [saved, readings],
  );
  const chartReadings = useMemo(
    () => (readings ?? []).map((r) => ({ day: readingDay(r.takenAt, saved.startDate), tanMgN: r.tanMgN, no2MgN: r.no2MgN, no3MgN: r.no3MgN })),
    [readings, saved.startDate],
  );

  const target = sliderTarget(events, selected);
  const targetEvent = target >= 0 ? (events[target] as Extract<ScenarioEvent, { type: 'add-fish' }>) : null;
  // The slider's range follows the saved plan, so it does not stretch while a finger drags it.
  // The slider moves the event's first kind of fish.
  const targetGroup = targetEvent?.fish[0] ?? null;
  const sliderMax = useMemo(
    () => Math.max(60, ...saved.events.map((e) => (e.type === 'add-fish' ? 2 * (e.fish[0]?.count ?? 0) : 0)), targetGroup?.count ?? 0),
    [saved.events, targetGroup?.count],
  );
  const onSlide = useCallback(
    (count: number) => {
      const e = useDraftStore.getState().drafts[planId]?.events[target];
      if (e?.type === 'add-fish' && e.fish[0]) updateEvent(planId, target, { ...e, fish: [{ ...e.fish[0], count }, ...e.fish.slice(1)] });
    },
    [planId, target, updateEvent],
  );
  const stocking = useMemo<StockingContext>(
    () => ({ volumeL: tank.volumeL, volumeText: formatVolume(tank.volumeL, prefs.volumeUnit), startFish: livestockFish(tank.livestock), events }),
    [tank.volumeL, tank.livestock, prefs.volumeUnit, events],
  );
  const tankSpecies = useMemo(() => tank.livestock.flatMap((l) => (l.speciesId ? [l.speciesId] : [])), [tank.livestock]);

  const onSave = () =>
    save.mutate(
      { name: draft?.name ?? saved.name, events },
      { onSuccess: (p) => markSaved(planId, p.updatedAt) },
    );
  const saveNow = async () => markSaved(planId, (await save.mutateAsync({ name: draft?.name ?? saved.name, events })).updatedAt);
  const saveErrors = save.error && isApiRequestError(save.error) ? save.error.fields : NO_FIELDS;
  // A refused save names events by path: the sentences say which event, the form shows the field.
  const saveProblems = useMemo(() => planErrors(saveErrors, events, ['name']), [saveErrors, events]);
  const liveProblems = useMemo(() => planErrors(live.fields ?? NO_FIELDS, events), [live.fields, events]);
  const selectedErrors = selected !== null ? (saveProblems.byEvent[selected] ?? liveProblems.byEvent[selected]) : undefined;

  const headerCard = (
      <Card testID="plan-header">
        <View style={{ flexDirection: 'row', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm }}>
          <Heading testID="plan-name">{draft?.name ?? saved.name}</Heading>
          <StatusPill tone={planStatusLabel[saved.status].tone} label={planStatusLabel[saved.status].label} testID="plan-status" />
        </View>
        <AppText tone="textMuted">{`${saved.tankName} · ${saved.status === 'draft' ? 'not started' : `day 0: ${saved.startDate}`} · ${eventCount(events.length)}${dirty ? ' (unsaved changes)' : ''}`}</AppText>
        <TextLink href={`/tanks/${saved.tankId}`} label="Open the tank" testID="plan-tank-link" />
        <TextLink href={`/print/plan/${planId}`} label="Printable plan" testID="plan-print-link" />
      </Card>
  );
  const lifeCard = <PlanLifeCard plan={saved} tank={tank} progress={progress} dirty={dirty} eventCount={events.length} save={saveNow} />;
  const sliderCard = targetEvent && !readOnly ? (
        <Card testID="plan-slider-card">
          <CountSlider
            label={`${fishName(targetGroup?.species, targetGroup?.name)} added on day ${targetEvent.day}`}
            value={targetGroup?.count ?? 1}
            min={1}
            max={sliderMax}
            onChange={onSlide}
            testID="fish-count-slider"
          />
          <AppText variant="caption" tone="textMuted">The forecast redraws as you move it; save to keep the change.</AppText>
        </Card>
  ) : null;
  const planColumn = readOnly ? (
    <View style={{ gap: space.lg, flex: 1, minWidth: 0 }}>
      <Card testID="plan-events">
        <Heading level={2}>What happened when</Heading>
        <View role="list" testID="event-timeline" style={{ gap: space.xs }}>
          {[...events].sort((a, b) => a.day - b.day).map((e, i) => (
            <AppText key={i} role="listitem">{`Day ${e.day}: ${describeEvent(e)}`}</AppText>
          ))}
        </View>
      </Card>
      <PlanCheckDaysCard checkDays={checkDays} progress={progress?.checkDays ?? null} basis={prefs.nitrogenBasis} />
    </View>
  ) : (
    <View style={{ gap: space.lg, flex: 1, minWidth: 0 }}>
      <Card testID="plan-events">
        <Heading level={2}>What happens when</Heading>
        <EventTimeline events={events} startDate={saved.startDate} selected={selected} onSelect={(i) => select(planId, i)} onRemove={(i) => { select(planId, null); removeEvent(planId, i); }} />
        <Heading level={3}>{selected !== null && events[selected] ? `Edit day ${events[selected].day}` : 'Add an event'}</Heading>
        <EventForm
          editing={selected !== null ? events[selected] ?? null : null}
          onSubmit={(e) => (selected !== null ? updateEvent(planId, selected, e) : addEvent(planId, e))}
          onCancel={selected !== null ? () => select(planId, null) : undefined}
          fishOnDay={(day) => fishOnDay(tankFish, events, day)}
          stocking={stocking}
          preferredSpecies={tankSpecies}
          initialErrors={selectedErrors}
        />
      </Card>

      <Card testID="plan-save">
        <TextField label="Plan name" value={draft?.name ?? saved.name} onChangeText={(v) => setName(planId, v)} error={saveErrors.name} testID="plan-name-field" />
        {save.isError ? (
          <Banner tone="danger" title="Not saved" message={saveProblems.sentences.join(' ') || (Object.keys(saveErrors).length ? undefined : save.error.message)} testID="plan-save-error" />
        ) : null}
        {save.isSuccess && !dirty ? <Banner tone="ok" title="Saved" message="The forecast now comes from the server, with its uncertainty band." testID="plan-saved" /> : null}
        <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
          <Button label="Save plan" onPress={onSave} busy={save.isPending} busyLabel="Saving…" disabled={!dirty} testID="plan-save-button" />
          {dirty ? <Button label="Undo changes" variant="secondary" onPress={() => { discard(planId); ensureDraft(planId, saved); }} testID="plan-discard" /> : null}
        </View>
      </Card>

      <PlanCheckDaysCard checkDays={checkDays} progress={dirty ? null : progress?.checkDays ?? null} basis={prefs.nitrogenBasis} />
    </View>
  );

  // The verdict first, then the chart; what the chart draws and where it starts from below it.
  const forecastCard = (
      <Card testID="plan-forecast">
        <Heading level={2}>Forecast</Heading>
        {live.fields && !shownFromServer ? (
          <Banner tone="watch" title="The forecast cannot run yet" message={`${liveProblems.sentences.join(' ')}${Object.keys(liveProblems.byEvent).length ? ' Open the event to fix it.' : ''}`} testID="forecast-refused" />
        ) : null}
        {server.isError && !dirty ? <Banner tone="watch" title="No saved forecast" message={server.error.message} testID="forecast-server-error" /> : null}
        {view ? (
          <>
            <ForecastVerdict view={view} basis={prefs.nitrogenBasis} />
            <ForecastChart view={view} basis={prefs.nitrogenBasis} showBand={shownFromServer} events={events} readings={chartReadings} />
            {saved.status !== 'draft' && readings ? (
              <ReadingsBesideForecast rows={readingsBesideForecast(readings, view, saved.startDate)} basis={prefs.nitrogenBasis} total={planReadings.data?.total ?? 0} finished={readOnly} />
            ) : null}
          </>
        ) : (
          <Loading label="Running the forecast…" testID="forecast-loading" />
        )}
        <AppText variant="caption" tone="textMuted" testID="forecast-source">
          {shownFromServer
            ? `Saved plan. Shaded: where 8 in 10 likely forecasts fall. Ammonia, nitrite and nitrate ${basisWords(prefs.nitrogenBasis)}.`
            : `Live forecast of your unsaved changes (no shading until you save). Ammonia, nitrite and nitrate ${basisWords(prefs.nitrogenBasis)}.`}
        </AppText>
        {shownFromServer ? (
          <ForecastStart state={server.data!.startState} basis={prefs.nitrogenBasis} fitBand={server.data!.fitBand} />
        ) : live.startState ? (
          <ForecastStart state={live.startState} basis={prefs.nitrogenBasis} />
        ) : null}
      </Card>
  );
  const adviceCard = readOnly ? null : (
      <Card>
        <AdvicePanel
          tank={tank}
          planId={planId}
          events={events}
          startDate={saved.startDate}
          onApplySchedule={(schedule) => {
            const next = applySchedule(useDraftStore.getState().drafts[planId]?.events ?? events, schedule);
            if (!next) return false;
            select(planId, null);
            setEvents(planId, next);
            return true;
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
        {lifeCard}
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
      {lifeCard}
      {sliderCard}
      {forecastCard}
      {planColumn}
      {adviceCard}
      {cautions}
      {shareCard}
    </View>
  );
}
