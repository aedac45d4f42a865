/**
 * What a plan does, as advice reports it. Safety is judged on the ensemble's members, not on
 * a single line: a plan is safe when at most 1 in 10 plausible forecasts ever crosses any
 * limit — the 90th percentile of the members' peak ratios (largest value/limit) is ≤ 1.
 * That also keeps the band's day-by-day 90 % line under every limit (each member's value on
 * a day is at most its own peak, so the day's 90th percentile is at most the 90th percentile
 * of the peaks), and it is the stricter of the two, since members peak on different days.
 *
 * Per limit the outcome reports the 90th percentile of the members' peak values, peak ratios
 * and days over, the median peak day, and the earliest first-crossing day among the members
 * at or above the 90th percentile. The band (10–50–90 % per day) is for drawing.
 */
import type { Forecast } from '../forecast';
import { bandOf, type EnsembleBand } from './ensemble';
import { EDGE_QUANTILE, judgeForecast, judgeSeries, type ForecastVerdict, type LimitVerdict } from './judge';
import { quantileSorted } from './quantiles';
import type { AppliedLimit } from './tank-limits';

export interface PlanOutcome {
  band: EnsembleBand;
  /** member-based verdict at the 90th percentile (see above) */
  upperEdge: ForecastVerdict;
  /** verdict of the median line */
  median: ForecastVerdict;
  /** 90th percentile of the members' own peak ratios over all limits */
  edgePeakRatio: number;
  /** members whose forecast crosses a limit, of all members */
  membersCrossing: number;
  members: number;
}

const q = (xs: number[], p: number) => quantileSorted(Float64Array.from(xs).sort(), p);

/** Outcome of a plan from its members' forecasts; the median line's pH and temperature come from `reference`. */
export function planOutcome(forecasts: readonly Forecast[], limits: readonly AppliedLimit[], reference: Forecast): PlanOutcome {
  const band = bandOf(forecasts);
  const verdicts = forecasts.map((f) => judgeForecast(f, limits));
  const perLimit = limits.map((limit, j): LimitVerdict => {
    const own = verdicts.map((v) => v.limits[j]);
    const ratio = q(own.map((v) => v.peakRatio), EDGE_QUANTILE);
    const crossing = own.filter((v) => v.peakRatio >= ratio && v.firstDayOver !== null).map((v) => v.firstDayOver as number);
    return {
      key: limit.key,
      peakRatio: ratio,
      peakValue: q(own.map((v) => v.peakValue), EDGE_QUANTILE),
      peakDay: q(own.map((v) => v.peakDay), 0.5),
      firstDayOver: ratio > 1 && crossing.length ? Math.min(...crossing) : null,
      daysOver: q(own.map((v) => v.daysOver), EDGE_QUANTILE),
    };
  });
  let worst = perLimit[0];
  for (const v of perLimit) if (v.peakRatio > worst.peakRatio) worst = v;
  const edgePeakRatio = q(verdicts.map((v) => v.peakRatio), EDGE_QUANTILE);
  const upperEdge: ForecastVerdict = { safe: edgePeakRatio <= 1, binding: worst.key, peakRatio: edgePeakRatio, limits: perLimit };
  const median = judgeSeries(
    {
      days: band.days,
      tanMgN: band.tanMgN.p50,
      freeNh3MgL: band.freeNh3MgL.p50,
      no2MgN: band.no2MgN.p50,
      ph: reference.series.ph,
      temperatureC: reference.series.temperatureC,
    },
    limits,
  );
  return {
    band,
    upperEdge,
    median,
    edgePeakRatio,
    membersCrossing: verdicts.filter((v) => !v.safe).length,
    members: forecasts.length,
  };
}
