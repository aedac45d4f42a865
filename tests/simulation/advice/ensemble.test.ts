import { describe, expect, it } from 'vitest';
import { runEnsemble, sampleEnsemble, sampledKeys } from '../../../simulation/advice/ensemble';
import { PARAMETERS } from '../../../simulation/parameters';
import { forecastParsed } from '../../../simulation/forecast';
import { matureTank } from './fixtures';

describe('the ensemble band (MODEL.md §5.2)', () => {
  const scenario = matureTank({ events: [{ type: 'add-fish', day: 0, fish: { species: 'platy', count: 20 } }] });
  const options = { horizonDays: 30, stepDays: 1 };

  it('is the same for the same seed and differs for another', () => {
    const a = runEnsemble(scenario, { seed: 7 }, options).band;
    const b = runEnsemble(scenario, { seed: 7 }, options).band;
    const c = runEnsemble(scenario, { seed: 8 }, options).band;
    expect(a).toEqual(b);
    expect(a.tanMgN.p90).not.toEqual(c.tanMgN.p90);
  });

  it('has at least 64 members and 10 ≤ 50 ≤ 90 % at every day', () => {
    const r = runEnsemble(scenario, {}, options);
    expect(r.forecasts.length).toBeGreaterThanOrEqual(64);
    r.band.tanMgN.p10.forEach((x, i) => {
      expect(x).toBeLessThanOrEqual(r.band.tanMgN.p50[i]);
      expect(r.band.tanMgN.p50[i]).toBeLessThanOrEqual(r.band.tanMgN.p90[i]);
    });
  });

  it('contains the forecast at the default values on most days (the defaults sit inside every range)', () => {
    const r = runEnsemble(scenario, {}, options);
    const f = forecastParsed(scenario, options);
    const inside = (key: 'tanMgN' | 'no2MgN') =>
      f.series[key].filter((x, i) => x >= r.band[key].p10[i] - 1e-9 && x <= r.band[key].p90[i] + 1e-9).length / f.series[key].length;
    expect(inside('tanMgN')).toBeGreaterThanOrEqual(0.9);
    expect(inside('no2MgN')).toBeGreaterThanOrEqual(0.9);
  });

  it('samples every ranged parameter inside its table range, one draw per stratum (Latin hypercube)', () => {
    const members = sampleEnsemble({ members: 64, seed: 3 });
    for (const k of sampledKeys()) {
      const { min, max } = PARAMETERS[k];
      const values = members.map((m) => m.parameters[k] as number);
      values.forEach((v) => expect(v >= min && v <= max).toBe(true));
      const log = min > 0 && max / min >= 10;
      const u = values.map((v) => (log ? Math.log(v / min) / Math.log(max / min) : (v - min) / (max - min)));
      expect(u.map((x) => Math.min(63, Math.floor(x * 64))).sort((a, b) => a - b)).toEqual(Array.from({ length: 64 }, (_, i) => i));
    }
  });
});
