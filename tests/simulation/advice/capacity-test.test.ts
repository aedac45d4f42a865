import { describe, expect, it } from 'vitest';
import { parseScenario } from '../../../simulation/scenario';
import { capacityTestProtocol, estimateCapacityFromTest, READING_HOURS } from '../../../simulation/advice/capacity-test';
import { roundToKit } from '../../../simulation/advice/kit-error';
import { forecastParsed } from '../../../simulation/forecast';

// An invented empty 60 L tank whose filter really clears 120 mg N/day; the prior guesses 40.
const tank = { volumeL: 60, temperatureC: 25, ph: 7.5, zones: [{ id: 'filter', kind: 'filter' as const, media: { type: 'sponge-coarse' as const, volumeL: 0.5 } }] };
const prior = parseScenario({ tank, start: { kind: 'explicit', capacities: [{ zoneId: 'filter', aoMgNPerDay: 40, noMgNPerDay: 40 }] }, feeding: { mode: 'grams', gramsPerDay: 0 } });
const truth = { ...prior, start: { kind: 'explicit' as const, capacities: [{ zoneId: 'filter', aoMgNPerDay: 120, noMgNPerDay: 120 }] } };

describe('capacity test', () => {
  const protocol = capacityTestProtocol(prior, { percentNH3: 10 });

  it('doses 0.5–4 mg N/L and reads at 0, 4, 8 and 24 hours (common practice for fishless tests)', () => {
    expect(protocol.doseMgNPerL).toBeGreaterThanOrEqual(0.5);
    expect(protocol.doseMgNPerL).toBeLessThanOrEqual(4);
    expect(protocol.readingHours).toEqual([0, 4, 8, 24]);
    expect(protocol.ammoniumChlorideG).toBeCloseTo((protocol.doseMgNPerL * 60) / 1000 / (14.007 / 53.489), 10); // IUPAC molar masses
    expect(protocol.cautions.join(' ')).toMatch(/gloves/);
  });

  it('estimates the capacity from kit-rounded readings within 25 % (four 0.25-step readings; common practice)', () => {
    const dosed = { ...truth, events: [{ type: 'ammonia-dose' as const, day: 0, amount: { unit: 'mgN-per-L' as const, value: protocol.doseMgNPerL } }] };
    const f = forecastParsed(dosed, { horizonDays: 1, stepDays: 1 / 24 });
    const kit = { stepMgN: 0.25, relativeError: 0.1 };
    const readings = READING_HOURS.map((h) => ({ hour: h, tanMgN: roundToKit(kit, f.series.tanMgN[h]) }));
    const estimate = estimateCapacityFromTest(prior, protocol.doseMgNPerL, readings, kit);
    expect(Math.abs(estimate.capacity.startAoMgNPerDay / 120 - 1)).toBeLessThan(0.25);
  }, 30_000);
});
