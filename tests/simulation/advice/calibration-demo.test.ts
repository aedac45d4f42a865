import { describe, expect, it } from 'vitest';
import { parseScenario } from '../../../simulation/scenario';
import { tankSetupSchema } from '../../../shared/schemas/tank';
import { tankScenario } from '../../../shared/tank-scenario';
import { bandChange, calibrate, describeBandChange } from '../../../simulation/advice/calibration';
import { forecastParsed } from '../../../simulation/forecast';
import { ionToN } from '../../../simulation/units';

/**
 * The demo's "Living-room community" tank (server/seed.ts): 120 L, canister filter, 19 fish,
 * tested twice a week for four weeks with ammonia and nitrite near zero (kit read as the ion).
 * `withHighTest` adds what a keeper logged in issue 14: total ammonia 2 and nitrite 1 mg N/L,
 * a reading the settled tank's model cannot follow — the case that took ~40 s to fit.
 */
function demoCommunity(withHighTest: boolean) {
  const readings: { day: number; tanMgN: number; no2MgN: number }[] = [];
  for (let k = 0; k < 8; k++) {
    const back = 27 - 3.5 * k;
    readings.push({ day: 3.5 * k, tanMgN: ionToN(0.1 + 0.05 * (Math.round(back) % 3), 'NH4'), no2MgN: ionToN(Math.round(back) % 4 === 0 ? 0.05 : 0, 'NO2') });
  }
  if (withHighTest) readings.push({ day: 26.3, tanMgN: 2, no2MgN: 1 });
  const lastDay = readings.at(-1)!.day;
  const { scenario } = tankScenario(
    {
      volumeL: 120,
      temperatureC: 25,
      ph: 7.2,
      khDkh: 5,
      tapWater: { tanMgN: 0.2, no2MgN: 0, no3MgN: 2 },
      setup: tankSetupSchema.parse({
        filter: { kind: 'canister', mediaVolumeL: 1.5, media: 'ceramic-rings' },
        substrate: { grain: 'sand', depthCm: 5 },
        hardscape: 'some',
        plants: 'moderate',
        lightHoursPerDay: 8,
      }),
      livestock: [
        { id: 'a', speciesId: 'neon-tetra', customName: null, count: 12, lengthCm: 3 },
        { id: 'b', speciesId: 'bronze-corydoras', customName: null, count: 6, lengthCm: 5.5 },
        { id: 'c', speciesId: 'bristlenose-pleco', customName: null, count: 1, lengthCm: 9 },
      ],
      readings: [null],
    },
    { events: [] },
    { horizonDays: Math.ceil(lastDay) + 1 },
  );
  return { scenario: parseScenario(scenario), readings };
}

// Forecasts per fit before the fix: a 75-point grid, then ml-levenberg-marquardt's full 60 iterations
// (5 forecasts each, it never stopped early), the best fit and 6 for the covariance: 383 on both
// histories. Now (measured): 83 and 92; the bounds leave room for engine tolerance changes.
const FORECASTS_BEFORE = 383;

describe('calibration on the demo tank’s own history (issue 16: the 40 s fit)', () => {
  it.each([
    ['settled readings', false, 100],
    ['settled readings and one high test', true, 110],
  ])('fits %s with a bounded number of forecasts and stops by convergence, not by running out of iterations', (_, high, most) => {
    const { scenario, readings } = demoCommunity(high);
    const result = calibrate({ scenario, readings });
    expect(result.quality.stop).not.toBe('iterations');
    expect(result.quality.forecasts).toBeLessThanOrEqual(most);
    expect(result.quality.forecasts).toBeLessThan(FORECASTS_BEFORE / 3);
    expect(result.quality.readings).toBe(readings.length * 2);
  }, 60_000);

  it("never starts the fitted filter above its zones' area ceiling (where the model's biofilm can only decay)", () => {
    const { scenario, readings } = demoCommunity(true);
    const result = calibrate({ scenario, readings });
    const start = result.calibratedScenario.start;
    expect(start.kind).toBe('explicit');
    const final = forecastParsed({ ...result.calibratedScenario, events: [] }, { horizonDays: 0.01 }).summary.final.zones;
    if (start.kind !== 'explicit') return;
    for (const c of start.capacities) {
      const z = final.find((f) => f.zoneId === c.zoneId)!;
      expect(c.aoMgNPerDay).toBeLessThanOrEqual(z.aoCeilingMgNPerDay * (1 + 1e-9));
      expect(c.noMgNPerDay).toBeLessThanOrEqual(z.noCeilingMgNPerDay * (1 + 1e-9));
    }
  }, 60_000);

  it("reports capacities on the chart's scale: the calibrated scenario's own forecast shows the same mg N a day for the whole tank", () => {
    const { scenario, readings } = demoCommunity(true);
    const result = calibrate({ scenario, readings });
    const lastDay = readings.at(-1)!.day;
    // What the capacity chart would draw for the fitted tank (shared/forecast-view sums the zones).
    const f = forecastParsed({ ...result.calibratedScenario, events: [] }, { horizonDays: lastDay, parameters: result.calibratedParameters });
    const total = (k: 'ao' | 'no', i: number) => f.series.zones.reduce((s, z) => s + z[k][i], 0);
    const last = f.series.days.length - 1;
    expect(total('ao', 0)).toBeCloseTo(result.capacity.startAoMgNPerDay, 6);
    expect(total('no', 0)).toBeCloseTo(result.capacity.startNoMgNPerDay, 6);
    expect(total('ao', last) / result.capacity.presentAoMgNPerDay).toBeCloseTo(1, 3);
    expect(total('no', last) / result.capacity.presentNoMgNPerDay).toBeCloseTo(1, 3);
  }, 60_000);

  it('says the band narrows only when it does, and by how much', () => {
    const { scenario, readings } = demoCommunity(true);
    const result = calibrate({ scenario, readings });
    const sentence = result.explanation.find((l) => l.startsWith('With the fit'))!;
    expect(sentence).toBe(describeBandChange(result.band.meanWidthTan, result.band.meanWidthNo2));
    for (const [what, w] of [['total ammonia', result.band.meanWidthTan], ['nitrite', result.band.meanWidthNo2]] as const) {
      const change = bandChange(w);
      expect(sentence).toMatch(new RegExp(`band for ${what} ${change === 'same' ? 'stays about as wide' : change}`));
      if (w.calibrated > w.prior) expect(sentence).not.toMatch(new RegExp(`band for ${what} narrows`));
    }
  }, 60_000);
});

describe('describeBandChange (the one wording of how the fit moves the band)', () => {
  it('gives the narrowing as a share of the old width', () => {
    expect(describeBandChange({ prior: 0.4, calibrated: 0.1 }, { prior: 0.2, calibrated: 0.15 })).toBe(
      'With the fit, the band for total ammonia narrows by 75 % (average width from 0.4 to 0.1 mg N/L) and the band for nitrite narrows by 25 % (average width from 0.2 to 0.15 mg N/L).',
    );
  });

  it('says "widens" when the calibrated band is wider (issue 14: it said "narrows from 0.309 to 3.42")', () => {
    const s = describeBandChange({ prior: 0.309, calibrated: 3.42 }, { prior: 0.2, calibrated: 0.201 });
    expect(s).toMatch(/^With the fit, the band for total ammonia widens \(average width from 0\.31 to 3\.4 mg N\/L\) and the band for nitrite stays about as wide/);
    expect(s).not.toMatch(/narrows/);
    expect(s).toMatch(/less sure/);
  });

  it('treats changes within 5 % as the same width', () => {
    expect(bandChange({ prior: 1, calibrated: 0.96 })).toBe('same');
    expect(bandChange({ prior: 1, calibrated: 1.04 })).toBe('same');
    expect(bandChange({ prior: 1, calibrated: 0.94 })).toBe('narrows');
    expect(bandChange({ prior: 1, calibrated: 1.06 })).toBe('widens');
  });
});
