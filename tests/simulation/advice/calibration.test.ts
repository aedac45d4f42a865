import { describe, expect, it } from 'vitest';
import { parseScenario } from '../../../simulation/scenario';
import { calibrate, scaledScenario } from '../../../simulation/advice/calibration';
import { roundToKit } from '../../../simulation/advice/kit-error';
import { normalDraw, seededRandom } from '../../../simulation/advice/random';
import { calibrationResponseSchema } from '../../../simulation/advice/schemas';
import { forecastParsed } from '../../../simulation/forecast';
import { DEVELOPER_WORDS } from './fixtures';

// An invented 100 L tank cycled with 1 mg N/L of ammonia a day (the fishless start-up of MODEL.md §9.2).
const scenario = parseScenario({
  tank: { volumeL: 100, temperatureC: 25, ph: 7.6, zones: [{ id: 'filter', kind: 'filter', media: { type: 'sponge-coarse', volumeL: 1 } }] },
  start: { kind: 'new' },
  events: [{ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 1 }, repeatEveryDays: 1, repeatCount: 40 }],
});
const kit = { stepMgN: 0.25, relativeError: 0.1 }; // colour charts step 0.25 mg/L (MODEL.md §5.2)

function synthetic(aoFactor: number, noFactor: number, growth: number, seed: number) {
  const day0 = forecastParsed(scenario, { horizonDays: 0.01, stepDays: 0.01 });
  const base = {
    start: day0.series.zones.map((z) => ({ zoneId: z.zoneId, ao: z.ao[0], no: z.no[0] })),
    water: { tanMgN: 0, no2MgN: 0, no3MgN: 0, orgMgN: 0 },
  };
  const truth = forecastParsed(scaledScenario(scenario, base, aoFactor, noFactor), {
    horizonDays: 45,
    stepDays: 0.5,
    parameters: { muMaxAo: 0.9 * growth, muMaxNo: 0.8 * growth },
  });
  const rnd = seededRandom(seed);
  const readings = [];
  for (let d = 1.5; d <= 45; d += 1.5) {
    const i = truth.series.days.indexOf(d);
    readings.push({
      day: d,
      tanMgN: roundToKit(kit, truth.series.tanMgN[i] * (1 + 0.05 * normalDraw(rnd))),
      no2MgN: roundToKit(kit, truth.series.no2MgN[i] * (1 + 0.05 * normalDraw(rnd))),
    });
  }
  const last = truth.series.days.length - 1;
  return {
    readings,
    ao: truth.series.zones.reduce((s, z) => s + z.ao[last], 0),
    no: truth.series.zones.reduce((s, z) => s + z.no[last], 0),
  };
}

describe('calibrate (Levenberg–Marquardt on kit-rounded synthetic readings)', () => {
  it('recovers the present capacities within 10 % from 30 days of rounded, noisy readings (issue 4 acceptance)', () => {
    const truth = synthetic(3, 0.5, 1.2, 5);
    const result = calibrate({ scenario, readings: truth.readings, kits: { tan: kit, no2: kit } });
    expect(Math.abs(result.capacity.presentAoMgNPerDay / truth.ao - 1)).toBeLessThan(0.1);
    expect(Math.abs(result.capacity.presentNoMgNPerDay / truth.no - 1)).toBeLessThan(0.1);
    expect(Math.abs(result.fitted.growthMultiplier / 1.2 - 1)).toBeLessThan(0.1);
    expect(result.quality.verdict).not.toBe('poor');
    expect(result.band.meanWidthTan.calibrated).toBeLessThan(result.band.meanWidthTan.prior);
    expect(result.band.meanWidthNo2.calibrated).toBeLessThan(result.band.meanWidthNo2.prior);
    expect(calibrationResponseSchema.safeParse(result).success).toBe(true);
    // Its words (issue 15): filter bacteria and the kit's colour chart, not nitrifiers or "colour steps".
    for (const line of result.explanation) expect(line).not.toMatch(DEVELOPER_WORDS);
    expect(result.explanation.join(' ')).toMatch(/filter bacteria could clear about .* shades of your kit's colour chart/);
  }, 30_000);

  it('reports a poor fit when readings contradict the model (ammonia and nitrite flat at 8 mg/L while dosing)', () => {
    const readings = Array.from({ length: 20 }, (_, i) => ({ day: 1 + 2 * i, tanMgN: 8, no2MgN: 8 }));
    const result = calibrate({ scenario, readings, kits: { tan: kit, no2: kit } });
    expect(result.quality.verdict).toBe('poor');
    expect(result.explanation.join(' ')).toMatch(/poor fit/);
  }, 30_000);

  it('refuses fewer readings than unknowns + 1', () => {
    expect(() => calibrate({ scenario, readings: [{ day: 1, tanMgN: 1 }] })).toThrow(RangeError);
  });
});
