/** The forecast's summary: peaks, days over each limit, the final capacities and the nitrogen balance. */
import { epaAcuteTan, epaChronicTan } from '../chemistry';
import { limitRecord, tankLimits, type TankLimits } from '../limits';
import type { Model } from '../model';
import type { ResolvedZone } from '../presets';
import type { Tank } from '../scenario';
import { daysOver, peakOf, type Excursion, type Peak } from '../series-stats';
import type { NitrogenBalance, NitrogenLedger } from './balance';
import type { ForecastOptions } from './options';
import { higherPeak, type EventPeaks } from './peaks';
import type { ForecastSeries } from './series';
import type { SpareCapacity } from './spare-capacity';

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
  /** At the forecast's first day: times today's load the populations clear before a kit shows it (null: no load, or the water already shows). */
  spareCapacity: SpareCapacity | null;
}

export interface SummaryInput {
  tank: Tank;
  zones: readonly ResolvedZone[];
  model: Model;
  series: ForecastSeries;
  eventPeaks: EventPeaks;
  ledger: NitrogenLedger;
  /** the closed balance (closeLedger) */
  balance: NitrogenBalance;
  /** first and last day of the run */
  startDay: number;
  horizon: number;
  options: Pick<ForecastOptions, 'limits' | 'limitChoices'>;
  spareCapacity: SpareCapacity | null;
}

export function summarize(input: SummaryInput): ForecastSummary {
  const { tank, zones, model, series, eventPeaks, ledger, horizon, options } = input;
  const act = model.current;
  const ns = series.days.length;
  const start = { ph: tank.ph, temperatureC: tank.temperatureC, chlorideMgL: tank.chlorideMgL };
  const startLimits = limitRecord(tankLimits(start, options.limitChoices), start);
  const fixed = options.limits ?? {};
  const chronic = limitSeries(series, fixed.tanChronicMgN, epaChronicTan);
  const acute = limitSeries(series, fixed.tanAcuteMgN, epaAcuteTan);
  const constant = (v: number) => new Array<number>(ns).fill(v);
  const last = ns - 1;
  const window = Math.min(7, horizon - input.startDay);
  const recentDose = recentDosedMg(ledger.doses, horizon - window, horizon) / window;
  return {
    peaks: {
      tan: higherPeak(peakOf(series.days, series.tanMgN), eventPeaks.tan),
      freeNh3: higherPeak(peakOf(series.days, series.freeNh3MgL), eventPeaks.freeNh3),
      no2: higherPeak(peakOf(series.days, series.no2MgN), eventPeaks.no2),
      no3: higherPeak(peakOf(series.days, series.no3MgN), eventPeaks.no3),
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
    nitrogenBalance: input.balance,
    spareCapacity: input.spareCapacity,
  };
}

/** mg dosed within (from, to]: pulses inside it, and the part of each continuous stretch that overlaps it. */
function recentDosedMg(doses: NitrogenLedger['doses'], from: number, to: number): number {
  let mg = 0;
  for (const d of doses) {
    if (d.to === d.from) {
      if (d.from > from - 1e-9) mg += d.mg;
      continue;
    }
    const overlap = Math.min(d.to, to) - Math.max(d.from, from);
    if (overlap > 0) mg += (d.mg * overlap) / (d.to - d.from);
  }
  return mg;
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
