import { describe, expect, it } from 'vitest';
import { parseScenario } from '../../../simulation/scenario';
import { capacityTestProtocol, estimateCapacityFromTest, READING_HOURS } from '../../../simulation/advice/capacity-test';
import { roundToKit } from '../../../simulation/advice/kit-error';
import { forecastParsed, KIT_FIRST_STEP_MG_N } from '../../../simulation/forecast';

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

describe('capacity test on a settled, stocked tank', () => {
  // An invented 120 L tank with 30 neon tetras, settled: the test must show a fall a kit can read.
  const stocked = parseScenario({
    tank: { volumeL: 120, temperatureC: 25, ph: 7.4, zones: [{ id: 'filter', kind: 'filter', media: { type: 'ceramic-rings', volumeL: 1.5 } }, { id: 'surfaces', kind: 'surfaces', areaM2: 1.5 }] },
    start: { kind: 'mature' },
    fish: [{ species: 'neon-tetra', count: 30 }],
  });
  const protocol = capacityTestProtocol(stocked);

  it('predicts a fall of the test dose a kit can read (at least one colour step, 0.25 mg/L as the ion) within 24 hours', () => {
    expect(protocol.expectedTanMgN[0] - protocol.expectedTanMgN[3]).toBeGreaterThanOrEqual(KIT_FIRST_STEP_MG_N.tan);
  });

  it('estimates the spare capacity from the readings, near the model\'s own figure (within 30 %)', () => {
    // The truth: the settled tank's own populations, no feeding during the test, the dose at hour 0.
    const settled = forecastParsed(stocked, { horizonDays: 1 });
    const capacities = settled.series.zones.map((z) => ({ zoneId: z.zoneId, aoMgNPerDay: z.ao[0], noMgNPerDay: z.no[0] }));
    const dosed = {
      ...stocked,
      start: { kind: 'explicit' as const, capacities },
      initialWater: { tanMgN: settled.series.tanMgN[0], no2MgN: settled.series.no2MgN[0] },
      feeding: { mode: 'grams' as const, gramsPerDay: 0 },
      events: [{ type: 'ammonia-dose' as const, day: 0, amount: { unit: 'mgN-per-L' as const, value: protocol.doseMgNPerL } }],
    };
    const f = forecastParsed(dosed, { horizonDays: 1, stepDays: 1 / 24 });
    const readings = READING_HOURS.map((h) => ({ hour: h, tanMgN: f.series.tanMgN[h] }));
    const estimate = estimateCapacityFromTest(stocked, protocol.doseMgNPerL, readings);
    const truth = settled.summary.spareCapacity!;
    expect(estimate.spareCapacity).not.toBeNull();
    expect(Math.abs(estimate.spareCapacity!.times / truth.times - 1)).toBeLessThan(0.3);
    expect(estimate.explanation.join(' ')).toMatch(/today's fish at once/);
  }, 30_000);
});
