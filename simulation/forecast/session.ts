/**
 * forecast(scenario, options): the nitrogen-cycle forecast of one tank over a timeline of
 * events (model.md). Pure: no I/O. Invalid input throws ScenarioError (with `.fields`)
 * before any solving; solver failure throws SolverError.
 *
 * Resumable runs: `createForecastSession` integrates forward on demand and hands out a
 * `ForecastState` at any day (the water and populations just before that day's events);
 * `forecastParsed(scenario, { from: state })` continues from it. The continued run applies
 * every event at or after the state's day and reports samples from that day on, so a
 * forecast of "the same plan plus one more event on day d" costs only the days after d. The
 * state remembers which scenario prefix (tank, start, fish, feeding, events before d,
 * parameters, feeding multiplier) produced it, and a mismatch is refused.
 */
import { parseScenario, ScenarioError, type Scenario, type ScenarioInput } from '../scenario';
import { feedNitrogenFlows, type FeedFlows, type Feeding } from '../bioload';
import { carbonateCo2, epaAcuteTan, epaChronicTan } from '../chemistry';
import { defaultLimits, type LimitChoices, type TankLimits } from '../limits';
import { aoIndex, createModel, I_KH, I_NO2, I_NO3, I_ORG, I_PLANT, I_TAN, noIndex, type Model, type SegmentConditions } from '../model';
import { resolveParameters, type ParameterOverrides, type Parameters } from '../parameters';
import { AERATION_OXYGEN_SHARE, PLANTING_UPTAKE_SHARE, resolveZone, type ResolvedZone } from '../presets';
import { createOdexIntegrator, SolverError, type IntegrationStats, type SamplingMode, type SegmentIntegrator } from '../solver';
import { LoadTooHighError, matureSteadyState } from '../steady-state';
import { daysOver, peakOf, type Excursion, type Peak } from '../series-stats';
import { buildTimeline, doseMgNPerL, type Breakpoint } from '../timeline';
import { MOLAR_MASS } from '../units';
import { overBudgetFields } from '../work-budget';

export interface ForecastOptions {
  /** Output interval, days (default 1). */
  stepDays?: number;
  /** Forecast length, days (default: scenario.horizonDays, else 60). */
  horizonDays?: number;
  /** Parameter overrides by key (see parameters.ts). */
  parameters?: ParameterOverrides;
  /** Fixed limits replacing the defaults (which follow the water's pH and temperature). */
  limits?: Partial<{ freeNh3MgNH3: number; tanChronicMgN: number; tanAcuteMgN: number; no2MgN: number }>;
  /** Which default limits to use. */
  limitChoices?: LimitChoices;
  /** Solver tolerances (see solver.ts for the defaults and why). */
  tolerances?: { relative?: number; concentration?: number; capacityPerLitre?: number };
  /**
   * A sample that falls exactly on an event instant shows the water just 'after' the events
   * (default) or just 'before' them — 'before' reads like a test taken before the day's dose.
   */
  eventSampling?: 'after' | 'before';
  /** How odex takes samples (see solver.ts); default 'restart'. */
  sampling?: SamplingMode;
  /** Step limit per segment. */
  maxSteps?: number;
  /**
   * Multiplies every feeding of the scenario (the starting one and feeding events): food
   * offered per day, whether given in grams or as a share of body mass. Default 1.
   */
  feedingMultiplier?: number;
  /** Continue from a saved state (see createForecastSession); the result starts at its day. */
  from?: ForecastState;
  /** Integrator factory (tests and the benchmark use a mathjs reference); default odex. */
  integrator?: (n: number, tolerances: { relative: number; absolute: number[] }) => SegmentIntegrator;
}

export interface ZoneSeries {
  zoneId: string;
  /** capacities at the water temperature, mg N/day */
  ao: number[];
  no: number[];
}

export interface ForecastSeries {
  days: number[];
  tanMgN: number[];
  /** free ammonia, mg NH3/L (as the molecule) */
  freeNh3MgL: number[];
  no2MgN: number[];
  no3MgN: number[];
  orgMgN: number[];
  /** °dKH, when pH follows carbonate hardness; else null */
  khDegrees: number[] | null;
  ph: number[];
  temperatureC: number[];
  zones: ZoneSeries[];
  /** TAN supplied by fish and detritus, mg N/day (doses excluded) */
  loadMgNPerDay: number[];
}

export interface NitrogenBalance {
  /** N in food offered, mg */
  feedOfferedMg: number;
  /** N kept in fish growth (leaves the water), mg */
  fishRetainedMg: number;
  dosedMg: number;
  tapWaterMg: number;
  waterChangeRemovedMg: number;
  /** nitrifier biomass N rinsed out or thrown away with media, mg */
  mediaCleaningMg: number;
  plantUptakeMg: number;
  /** dissolved + detritus + biomass N at start and end, mg */
  storedStartMg: number;
  storedEndMg: number;
  /** storedEnd − storedStart − (inputs − outputs) */
  residualMg: number;
  /** residual / largest of the terms */
  relativeResidual: number;
}

export interface ForecastSummary {
  peaks: { tan: Peak; freeNh3: Peak; no2: Peak; no3: Peak };
  /** Limits at the starting pH and temperature (the per-day check follows the water). */
  limits: TankLimits;
  daysOver: { freeNh3: Excursion; tanChronic: Excursion; tanAcute: Excursion; no2: Excursion };
  final: {
    zones: { zoneId: string; aoMgNPerDay: number; noMgNPerDay: number; aoCeilingMgNPerDay: number; noCeilingMgNPerDay: number }[];
    aoMgNPerDay: number;
    noMgNPerDay: number;
    /** TAN from fish and detritus at the end, mg N/day */
    loadMgNPerDay: number;
    /** ammonia dosed over the last 7 days (or the whole forecast if shorter), mg N/day */
    recentDoseMgNPerDay: number;
  };
  nitrogenBalance: NitrogenBalance;
}

/**
 * The water and nitrifiers at one day, just before that day's events, with the conditions
 * earlier events set — enough to continue the forecast from there (`options.from`).
 */
export interface ForecastState {
  day: number;
  /** model state vector (model.ts: TAN, NO2, NO3, ORG, KH, plant uptake, reference capacities) */
  y: readonly number[];
  temperatureC: number;
  feeding: Feeding;
  fishMassG: number;
  /** active medications and aeration losses: [position among the events before `day`, multiplier] */
  medications: readonly (readonly [number, number])[];
  aerationLosses: readonly (readonly [number, number])[];
  /** last accepted solver step, days (a continued run starts with it, as an uninterrupted one would) */
  stepHint: number | null;
  /** identifies the scenario prefix, parameters and feeding multiplier that produced the state */
  key: string;
}

/** What the forecast shows at the session's current day (before that day's events). */
export interface ForecastReading {
  day: number;
  tanMgN: number;
  no2MgN: number;
  no3MgN: number;
  orgMgN: number;
  /** capacities at the water temperature, mg N/day */
  zones: { zoneId: string; aoMgNPerDay: number; noMgNPerDay: number }[];
  aoMgNPerDay: number;
  noMgNPerDay: number;
}

/** A forecast integrated forward on demand. */
export interface ForecastSession {
  /** Current day (the state is just before this day's events). */
  readonly day: number;
  /** Samples recorded so far (all sample times before `day`). */
  readonly samples: number;
  /** Full-length series buffers; entries at index ≥ `samples` are not yet filled. */
  readonly series: ForecastSeries;
  /** Integrates to `day` (≥ the current day, ≤ the horizon); samples before it are then filled. */
  runTo(day: number): void;
  /** Integrates to `day` like runTo and returns the state there. */
  advanceTo(day: number): ForecastState;
  /** The water and capacities at the current day. */
  reading(): ForecastReading;
  /** Runs to the horizon and returns the forecast (the session cannot be used afterwards). */
  finish(): Forecast;
}

export interface Forecast {
  series: ForecastSeries;
  summary: ForecastSummary;
  stats: IntegrationStats & { segments: number };
}

const DEFAULT_HORIZON = 60;
const MAX_SAMPLES = 100_000;

/** Runs a forecast; `scenario` may be raw input (validated here) or already parsed. */
export function forecast(scenario: ScenarioInput | Scenario, options: ForecastOptions = {}): Forecast {
  return forecastParsed(parseScenario(scenario), options);
}

function optionError(field: string, message: string): ScenarioError {
  return new ScenarioError({ [field]: message });
}

function resolveOptions(scenario: Scenario, options: ForecastOptions) {
  const horizon = options.horizonDays ?? scenario.horizonDays ?? DEFAULT_HORIZON;
  const step = options.stepDays ?? 1;
  if (!(Number.isFinite(horizon) && horizon > 0 && horizon <= 3650)) throw optionError('options.horizonDays', 'Horizon must be above 0 and at most 3650 days.');
  if (!(Number.isFinite(step) && step > 0)) throw optionError('options.stepDays', 'Step must be above 0 days.');
  if (horizon / step > MAX_SAMPLES) throw optionError('options.stepDays', `At most ${MAX_SAMPLES} samples; use a longer step.`);
  let params: Parameters;
  try {
    params = resolveParameters(options.parameters);
  } catch (e) {
    throw optionError('options.parameters', (e as Error).message);
  }
  const feedingMultiplier = options.feedingMultiplier ?? 1;
  if (!(Number.isFinite(feedingMultiplier) && feedingMultiplier >= 0)) throw optionError('options.feedingMultiplier', 'Feeding multiplier must be 0 or more.');
  const tol = options.tolerances ?? {};
  return {
    feedingMultiplier,
    horizon,
    step,
    params,
    relative: tol.relative ?? 1e-6,
    concentration: tol.concentration ?? 1e-7,
    capacityPerLitre: tol.capacityPerLitre ?? 1e-9,
  };
}

/** Forecast of an already-parsed scenario (skips schema parsing; for batch callers). */
export function forecastParsed(scenario: Scenario, options: ForecastOptions = {}): Forecast {
  return createForecastSession(scenario, options).finish();
}

/** JSON of what a state depends on before `day` (see ForecastState.key). */
function prefixKey(scenario: Scenario, options: ForecastOptions, feedingMultiplier: number, day: number): string {
  const prefix = scenario.events.filter((e) => e.day < day - 1e-9);
  return JSON.stringify([scenario.tank, scenario.start, scenario.initialWater, scenario.fish, scenario.feeding, options.parameters ?? null, feedingMultiplier, prefix]);
}

/** Indices (into scenario.events) of the events before `day`, in array order. */
function prefixIndices(scenario: Scenario, day: number): number[] {
  const out: number[] = [];
  scenario.events.forEach((e, i) => {
    if (e.day < day - 1e-9) out.push(i);
  });
  return out;
}

/** Starts a forecast that integrates forward on demand (see ForecastSession). */
export function createForecastSession(scenario: Scenario, options: ForecastOptions = {}): ForecastSession {
  const opt = resolveOptions(scenario, options);
  const p = opt.params;
  const tank = scenario.tank;
  const V = tank.volumeL;
  const zones = tank.zones.map(resolveZone);
  const nz = zones.length;
  const model = createModel(zones, V, p);
  const n = model.n;
  const overBudget = overBudgetFields(scenario, opt.horizon);
  if (overBudget) throw new ScenarioError(overBudget);
  const timeline = buildTimeline(scenario, opt.horizon, p);
  const from = options.from;
  const t0 = from ? from.day : 0;
  if (from) {
    if (!(Number.isFinite(t0) && t0 >= 0 && t0 < opt.horizon)) throw optionError('options.from', 'The saved state must lie before the horizon.');
    if (from.y.length !== n) throw optionError('options.from', 'The saved state belongs to a tank with other zones.');
    if (from.key !== prefixKey(scenario, options, opt.feedingMultiplier, t0)) {
      throw optionError('options.from', 'The saved state belongs to another scenario (tank, start, fish, feeding, parameters or events before its day differ).');
    }
  }

  // --- conditions that events change -------------------------------------------------
  const phModel = tank.phModel ?? (tank.khDegrees !== undefined && tank.khDegrees > 0 ? 'carbonate' : 'fixed');
  const kh0 = tank.khDegrees ?? 0;
  const co2 = phModel === 'carbonate' ? carbonateCo2(kh0, tank.ph, tank.temperatureC) : 0;
  const tapKh = tank.tapWater.khDegrees ?? kh0;
  const fm = opt.feedingMultiplier;
  let temperature = from ? from.temperatureC : tank.temperatureC;
  let feeding: Feeding = from ? from.feeding : scenario.feeding;
  let fishMass = from ? from.fishMassG : timeline.initialFishMassG;
  const medications = new Map<number, number>();
  const aerationLosses = new Map<number, number>();
  if (from) {
    const idx = prefixIndices(scenario, t0);
    for (const [pos, m] of from.medications) medications.set(idx[pos], m);
    for (const [pos, a] of from.aerationLosses) aerationLosses.set(idx[pos], a);
  }
  let feedFlows = feedNitrogenFlows(fishMass, feeding, p, fm);
  const checkFlows = (field: string) => {
    if (feedFlows.toOrg < -1e-12) throw optionError(field, 'Feed parameters give more N out of the food than it holds.');
  };
  checkFlows('options.parameters');

  const conditions = (): SegmentConditions => {
    let activity = 1;
    for (const m of medications.values()) activity *= m;
    let oxygen = AERATION_OXYGEN_SHARE[tank.aeration];
    for (const a of aerationLosses.values()) oxygen *= a;
    return {
      temperatureC: temperature,
      ph: tank.ph,
      phModel,
      co2MgL: co2,
      oxygenShare: oxygen,
      activityMultiplier: activity,
      excretionTan: feedFlows.excretedTan / V,
      orgInput: feedFlows.toOrg / V,
      plantUptake: p.plantUptakeHeavy * PLANTING_UPTAKE_SHARE[tank.plants],
      lightHoursPerDay: tank.lightHoursPerDay,
    };
  };
  model.setConditions(conditions());

  // --- initial state -------------------------------------------------------------------
  const y = new Array<number>(n).fill(0);
  const act = model.current;
  if (from) {
    for (let i = 0; i < n; i++) y[i] = from.y[i];
  } else {
    initialState(scenario, model, zones, feedFlows, kh0, y, p);
  }
  const plantStart = y[I_PLANT];

  // --- output buffers ------------------------------------------------------------------
  // Samples on the global grid k·step from the start day on (a continued run lines up with a full one).
  const nGrid = Math.floor(opt.horizon / opt.step + 1e-9);
  const times: number[] = [];
  for (let j = Math.max(0, Math.ceil(t0 / opt.step - 1e-9)); j <= nGrid; j++) times.push(j * opt.step);
  if (times.length === 0 || opt.horizon - times[times.length - 1] > 1e-9) times.push(opt.horizon);
  const ns = times.length;
  const alloc = () => new Array<number>(ns).fill(0);
  const series: ForecastSeries = {
    days: times.slice(),
    tanMgN: alloc(),
    freeNh3MgL: alloc(),
    no2MgN: alloc(),
    no3MgN: alloc(),
    orgMgN: alloc(),
    khDegrees: phModel === 'carbonate' ? alloc() : null,
    ph: alloc(),
    temperatureC: alloc(),
    zones: zones.map((z) => ({ zoneId: z.id, ao: alloc(), no: alloc() })),
    loadMgNPerDay: alloc(),
  };
  const toNH3 = MOLAR_MASS.NH3 / MOLAR_MASS.N;
  const record = (k: number, s: ArrayLike<number>) => {
    series.tanMgN[k] = s[I_TAN];
    series.no2MgN[k] = s[I_NO2];
    series.no3MgN[k] = s[I_NO3];
    series.orgMgN[k] = s[I_ORG];
    if (series.khDegrees) series.khDegrees[k] = s[I_KH];
    series.ph[k] = model.phOf(s[I_KH]);
    series.freeNh3MgL[k] = s[I_TAN] * model.freeFractionOf(s[I_KH]) * toNH3;
    series.temperatureC[k] = temperature;
    for (let z = 0; z < nz; z++) {
      series.zones[z].ao[k] = s[aoIndex(z)] * act.activityAo;
      series.zones[z].no[k] = s[noIndex(z)] * act.activityNo;
    }
    series.loadMgNPerDay[k] = (act.excretionTan + act.ammonification * s[I_ORG]) * V;
  };

  // --- nitrogen bookkeeping ------------------------------------------------------------
  const bn = model.biomassNPerCapacity;
  const stored = (s: ArrayLike<number>) => {
    let total = V * (s[I_TAN] + s[I_NO2] + s[I_NO3] + s[I_ORG]);
    for (let z = 0; z < nz; z++) total += bn.ao * s[aoIndex(z)] + bn.no * s[noIndex(z)];
    return total;
  };
  const balance: NitrogenBalance = {
    feedOfferedMg: 0,
    fishRetainedMg: 0,
    dosedMg: 0,
    tapWaterMg: 0,
    waterChangeRemovedMg: 0,
    mediaCleaningMg: 0,
    plantUptakeMg: 0,
    storedStartMg: stored(y),
    storedEndMg: 0,
    residualMg: 0,
    relativeResidual: 0,
  };
  const doses: { time: number; mg: number }[] = [];
  // Peaks may fall between samples at event instants (a dose lands at once): track those too.
  const eventPeaks = { tan: { value: -Infinity, day: 0 }, freeNh3: { value: -Infinity, day: 0 }, no2: { value: -Infinity, day: 0 }, no3: { value: -Infinity, day: 0 } };
  const notePeaks = (t: number) => {
    const fa = y[I_TAN] * model.freeFractionOf(y[I_KH]) * toNH3;
    if (y[I_TAN] > eventPeaks.tan.value) eventPeaks.tan = { value: y[I_TAN], day: t };
    if (fa > eventPeaks.freeNh3.value) eventPeaks.freeNh3 = { value: fa, day: t };
    if (y[I_NO2] > eventPeaks.no2.value) eventPeaks.no2 = { value: y[I_NO2], day: t };
    if (y[I_NO3] > eventPeaks.no3.value) eventPeaks.no3 = { value: y[I_NO3], day: t };
  };

  const applyBreakpoint = (bp: Breakpoint) => {
    for (const action of bp.actions) {
      if (action.kind === 'end-medication') {
        medications.delete(action.index);
        continue;
      }
      if (action.kind === 'end-aeration-loss') {
        aerationLosses.delete(action.index);
        continue;
      }
      const e = action.event;
      switch (e.type) {
        case 'water-change': {
          const f = e.percent / 100;
          const tap = tank.tapWater;
          balance.waterChangeRemovedMg += f * V * (y[I_TAN] + y[I_NO2] + y[I_NO3] + y[I_ORG]);
          balance.tapWaterMg += f * V * (tap.tanMgN + tap.no2MgN + tap.no3MgN);
          y[I_TAN] = (1 - f) * y[I_TAN] + f * tap.tanMgN;
          y[I_NO2] = (1 - f) * y[I_NO2] + f * tap.no2MgN;
          y[I_NO3] = (1 - f) * y[I_NO3] + f * tap.no3MgN;
          y[I_ORG] = (1 - f) * y[I_ORG];
          if (phModel === 'carbonate') y[I_KH] = (1 - f) * y[I_KH] + f * tapKh;
          break;
        }
        case 'ammonia-dose': {
          const c = doseMgNPerL(e.amount, V);
          y[I_TAN] += c;
          balance.dosedMg += c * V;
          doses.push({ time: bp.time, mg: c * V });
          break;
        }
        case 'filter-clean': {
          const z = zones.findIndex((zone) => zone.id === e.zoneId);
          const lostAo = y[aoIndex(z)] * e.shareLost;
          const lostNo = y[noIndex(z)] * e.shareLost;
          balance.mediaCleaningMg += bn.ao * lostAo + bn.no * lostNo;
          y[aoIndex(z)] -= lostAo;
          y[noIndex(z)] -= lostNo;
          break;
        }
        case 'medication':
          medications.set(action.index, e.oxidationMultiplier);
          break;
        case 'aeration-loss':
          aerationLosses.set(action.index, e.oxygenShare);
          break;
        case 'temperature':
          temperature = e.temperatureC;
          break;
        case 'feeding':
          feeding = e.feeding;
          break;
        case 'add-fish':
        case 'remove-fish':
        case 'move-fish':
          break; // fish mass comes from the timeline (bp.fishMassG)
      }
    }
    fishMass = bp.fishMassG;
    feedFlows = feedNitrogenFlows(fishMass, feeding, p, fm);
    model.setConditions(conditions());
  };

  // --- integrate segment by segment ------------------------------------------------------
  const absolute = new Array<number>(n).fill(opt.concentration);
  absolute[I_PLANT] = opt.concentration * V;
  for (let z = 0; z < nz; z++) {
    absolute[aoIndex(z)] = opt.capacityPerLitre * V;
    absolute[noIndex(z)] = opt.capacityPerLitre * V;
  }
  const tolerances = { relative: opt.relative, absolute };
  const integrator = options.integrator
    ? options.integrator(n, tolerances)
    : createOdexIntegrator(n, { tolerances, maxSteps: options.maxSteps, sampling: options.sampling });
  if (from && from.stepHint !== null && integrator.stepSize !== undefined) integrator.stepSize = from.stepHint;
  const rhs = model.rhs;

  // Breakpoints before the start day were applied in the run that saved the state.
  const bps = timeline.breakpoints;
  let bi = 0;
  while (bi < bps.length && bps[bi].time < t0 - 1e-9) bi++;
  let t = t0;
  let k = 0;
  let segments = 0;
  const work: IntegrationStats = { steps: 0, accepted: 0, rejected: 0, evaluations: 0 };
  let started = false;
  let finished = false;
  const before = options.eventSampling === 'before';

  /** Integrates to `stop`; events at `stop` are applied only when `final`. */
  const advance = (stop: number, final: boolean) => {
    while (true) {
      if (!final && t >= stop - 1e-9) return;
      if (bi < bps.length && bps[bi].time <= t + 1e-9) {
        // Samples at an event instant show the water after the events ('before': before them).
        if (before) while (k < ns && times[k] <= t + 1e-9) record(k++, y);
        applyBreakpoint(bps[bi++]);
        notePeaks(t);
        continue;
      }
      if (!started) {
        notePeaks(t);
        started = true;
      }
      if (t >= stop - 1e-9) return;
      const tEnd = bi < bps.length && bps[bi].time < stop ? bps[bi].time : stop;
      let kEnd = k;
      while (kEnd < ns && times[kEnd] < tEnd - 1e-9) kEnd++;
      const dt = tEnd - t;
      balance.feedOfferedMg += feedFlows.offeredN * dt;
      balance.fishRetainedMg += feedFlows.retained * dt;
      const segment = integrator.integrate({ f: rhs, from: t, to: tEnd, y, times, first: k, end: kEnd, sink: record });
      work.steps += segment.stats.steps;
      work.accepted += segment.stats.accepted;
      work.rejected += segment.stats.rejected;
      work.evaluations += segment.stats.evaluations;
      segments++;
      if (!segment.outcome.ok) throw new SolverError(segment.outcome.message);
      k = kEnd;
      t = tEnd;
    }
  };

  // The key only changes when another event falls before the day: reuse it between those.
  let lastKey: { count: number; last: number; key: string } | null = null;
  const snapshot = (): ForecastState => {
    const idx = prefixIndices(scenario, t);
    const pos = new Map(idx.map((i, j) => [i, j] as const));
    const lastIdx = idx.length ? idx[idx.length - 1] : -1;
    if (!lastKey || lastKey.count !== idx.length || lastKey.last !== lastIdx) {
      lastKey = { count: idx.length, last: lastIdx, key: prefixKey(scenario, options, fm, t) };
    }
    return {
      day: t,
      y: y.slice(),
      temperatureC: temperature,
      feeding,
      fishMassG: fishMass,
      medications: [...medications].map(([i, m]) => [pos.get(i) as number, m] as const),
      aerationLosses: [...aerationLosses].map(([i, a]) => [pos.get(i) as number, a] as const),
      stepHint: integrator.stepSize ?? null,
      key: lastKey.key,
    };
  };
  const alive = () => {
    if (finished) throw new Error('the forecast session has finished');
  };

  const finish = (): Forecast => {
    alive();
    advance(opt.horizon, true);
    finished = true;
    // Samples at the horizon (after any events there).
    while (k < ns) record(k++, y);

    balance.plantUptakeMg = y[I_PLANT] - plantStart;
    balance.storedEndMg = stored(y);
    const inputs = balance.feedOfferedMg - balance.fishRetainedMg + balance.dosedMg + balance.tapWaterMg;
    const outputs = balance.waterChangeRemovedMg + balance.mediaCleaningMg + balance.plantUptakeMg;
    balance.residualMg = balance.storedEndMg - balance.storedStartMg - (inputs - outputs);
    const scale = Math.max(balance.storedStartMg, balance.storedEndMg, inputs, outputs, 1e-300);
    balance.relativeResidual = balance.residualMg / scale;

    // --- summary -------------------------------------------------------------------------
    const startLimits = defaultLimits({ ph: tank.ph, temperatureC: tank.temperatureC, chlorideMgL: tank.chlorideMgL }, options.limitChoices);
    const fixed = options.limits ?? {};
    const chronic = limitSeries(series, fixed.tanChronicMgN, epaChronicTan);
    const acute = limitSeries(series, fixed.tanAcuteMgN, epaAcuteTan);
    const constant = (v: number) => new Array<number>(ns).fill(v);
    const pick = (a: Peak, b: { value: number; day: number }): Peak => (b.value > a.value ? { value: b.value, day: b.day } : a);
    const last = ns - 1;
    const window = Math.min(7, opt.horizon - t0);
    const recentDose = doses.filter((d) => d.time > opt.horizon - window - 1e-9).reduce((s, d) => s + d.mg, 0) / window;
    const summary: ForecastSummary = {
      peaks: {
        tan: pick(peakOf(series.days, series.tanMgN), eventPeaks.tan),
        freeNh3: pick(peakOf(series.days, series.freeNh3MgL), eventPeaks.freeNh3),
        no2: pick(peakOf(series.days, series.no2MgN), eventPeaks.no2),
        no3: pick(peakOf(series.days, series.no3MgN), eventPeaks.no3),
      },
      limits: startLimits,
      daysOver: {
        freeNh3: daysOver(series.days, series.freeNh3MgL, constant(fixed.freeNh3MgNH3 ?? startLimits.freeNh3.value)),
        tanChronic: daysOver(series.days, series.tanMgN, chronic),
        tanAcute: daysOver(series.days, series.tanMgN, acute),
        no2: daysOver(series.days, series.no2MgN, constant(fixed.no2MgN ?? startLimits.nitrite.value)),
      },
      final: {
        zones: zones.map((zone, z) => ({
          zoneId: zone.id,
          aoMgNPerDay: series.zones[z].ao[last],
          noMgNPerDay: series.zones[z].no[last],
          aoCeilingMgNPerDay: model.ceilingAo[z] * act.activityAo,
          noCeilingMgNPerDay: model.ceilingNo[z] * act.activityNo,
        })),
        aoMgNPerDay: series.zones.reduce((s, z) => s + z.ao[last], 0),
        noMgNPerDay: series.zones.reduce((s, z) => s + z.no[last], 0),
        loadMgNPerDay: series.loadMgNPerDay[last],
        recentDoseMgNPerDay: recentDose,
      },
      nitrogenBalance: balance,
    };
    return { series, summary, stats: { ...work, segments } };
  };

  return {
    get day() {
      return t;
    },
    get samples() {
      return k;
    },
    series,
    runTo(day: number): void {
      alive();
      if (!(day >= t - 1e-9 && day <= opt.horizon + 1e-9)) throw new RangeError(`runTo(${day}): the day must lie between ${t} and the horizon ${opt.horizon}`);
      advance(day, false);
    },
    advanceTo(day: number): ForecastState {
      this.runTo(day);
      return snapshot();
    },
    reading(): ForecastReading {
      const zs = zones.map((zone, z) => ({ zoneId: zone.id, aoMgNPerDay: y[aoIndex(z)] * act.activityAo, noMgNPerDay: y[noIndex(z)] * act.activityNo }));
      return {
        day: t,
        tanMgN: y[I_TAN],
        no2MgN: y[I_NO2],
        no3MgN: y[I_NO3],
        orgMgN: y[I_ORG],
        zones: zs,
        aoMgNPerDay: zs.reduce((s, z) => s + z.aoMgNPerDay, 0),
        noMgNPerDay: zs.reduce((s, z) => s + z.noMgNPerDay, 0),
      };
    },
    finish,
  };
}

/**
 * A TAN limit per sample: a fixed value, or the EPA formula at each sample's pH and
 * temperature — computed once per run of equal (pH, T), since with a fixed pH it rarely changes.
 */
function limitSeries(series: ForecastSeries, fixed: number | undefined, formula: (ph: number, t: number) => number): number[] {
  const n = series.days.length;
  const out = new Array<number>(n);
  if (fixed !== undefined) return out.fill(fixed);
  let ph = NaN;
  let temp = NaN;
  let v = 0;
  for (let i = 0; i < n; i++) {
    if (series.ph[i] !== ph || series.temperatureC[i] !== temp) {
      ph = series.ph[i];
      temp = series.temperatureC[i];
      v = formula(ph, temp);
    }
    out[i] = v;
  }
  return out;
}

/** Day-0 water and populations of a scenario (new, explicit or mature start), written into y. */
function initialState(scenario: Scenario, model: Model, zones: readonly ResolvedZone[], feedFlows: FeedFlows, kh0: number, y: number[], p: Parameters): void {
  const tank = scenario.tank;
  const V = tank.volumeL;
  const nz = zones.length;
  const w = scenario.initialWater;
  y[I_TAN] = w.tanMgN ?? tank.tapWater.tanMgN;
  y[I_NO2] = w.no2MgN ?? tank.tapWater.no2MgN;
  y[I_NO3] = w.no3MgN ?? tank.tapWater.no3MgN;
  y[I_ORG] = w.orgMgN ?? 0;
  y[I_KH] = kh0;
  const start = scenario.start;
  const act = model.current;
  if (start.kind === 'new') {
    // Inoculum per litre at the tank temperature, shared among zones by area.
    const perL = start.inoculumMgNPerLPerDay ?? p.inoculum;
    const totalArea = zones.reduce((s, z) => s + z.areaM2, 0);
    for (let z = 0; z < nz; z++) {
      const share = zones[z].areaM2 / totalArea;
      y[aoIndex(z)] = (perL * V * share) / act.activityAo;
      y[noIndex(z)] = (perL * V * share) / act.activityNo;
    }
  } else if (start.kind === 'explicit') {
    for (const c of start.capacities) {
      const z = zones.findIndex((zone) => zone.id === c.zoneId);
      y[aoIndex(z)] = c.aoMgNPerDay / act.activityAo;
      y[noIndex(z)] = c.noMgNPerDay / act.activityNo;
    }
  } else {
    const load = start.loadMgNPerDay ?? feedFlows.excretedTan + feedFlows.toOrg;
    let ss;
    try {
      ss = matureSteadyState(model, load, kh0);
    } catch (e) {
      if (e instanceof LoadTooHighError) {
        throw optionError(start.loadMgNPerDay === undefined ? 'fish' : 'start.loadMgNPerDay', e.message);
      }
      throw e;
    }
    y[I_TAN] = w.tanMgN ?? ss.tan + tank.tapWater.tanMgN;
    y[I_NO2] = w.no2MgN ?? ss.no2 + tank.tapWater.no2MgN;
    y[I_ORG] = w.orgMgN ?? ss.org;
    for (let z = 0; z < nz; z++) {
      y[aoIndex(z)] = ss.capAo[z];
      y[noIndex(z)] = ss.capNo[z];
    }
  }
}
