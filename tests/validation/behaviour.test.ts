/**
 * Behaviours of the trade (MODEL.md §9.2) at default parameters. Sources: [practice] unless named; the
 * start-up windows are Lekang (Aquaculture Engineering) and Mnyoro et al. (2022).
 */
import { describe, expect, it } from 'vitest';
import { feedNitrogenFlows, fishMassG } from '@/simulation/bioload';
import { forecast } from '@/simulation/forecast';
import { DEFAULT_PARAMETERS } from '@/simulation/parameters';
import { peakOf, settledBelowDay } from '@/simulation/series-stats';
import type { ScenarioInput } from '@/simulation/scenario';
import { matureWithPlaties, startUp, tank } from '../simulation/scenarios';

const before = { horizonDays: 60, eventSampling: 'before' as const };

function startUpTimeline(s: ScenarioInput) {
  const f = forecast(s, before);
  const { days, tanMgN, no2MgN } = f.series;
  const tanPeak = peakOf(days, tanMgN);
  const no2Peak = peakOf(days, no2MgN);
  return { f, tanPeak, no2Peak, settled: settledBelowDay(days, [tanMgN, no2MgN], 0.2, tanPeak.day) };
}

const aoAt = (s: ScenarioInput, day: number) => {
  const f = forecast(s, before);
  return f.series.zones.reduce((sum, z) => sum + z.ao[day], 0);
};

describe('new-tank start-up (25 °C, 1 mg N/L dosed daily, inoculum 1e-4 mg N/L/d)', () => {
  const { tanPeak, no2Peak, settled } = startUpTimeline(startUp());

  it('peaks TAN first, about day 5–14 (Lekang; MODEL.md §9.2)', () => {
    expect(tanPeak.day).toBeGreaterThanOrEqual(5);
    expect(tanPeak.day).toBeLessThanOrEqual(14);
  });

  it('peaks nitrite later, about day 14–25 (Lekang; MODEL.md §9.2)', () => {
    expect(no2Peak.day).toBeGreaterThanOrEqual(14);
    expect(no2Peak.day).toBeLessThanOrEqual(25);
    expect(no2Peak.day).toBeGreaterThan(tanPeak.day);
  });

  it('brings both below 0.2 mg N/L by about day 25–45 (Lekang 20–40 d; Mnyoro et al. 2022 6–7 weeks)', () => {
    expect(settled).not.toBeNull();
    expect(settled!).toBeGreaterThanOrEqual(25);
    expect(settled!).toBeLessThanOrEqual(45);
  });

  it('is shortened to days by seeding with mature media (MODEL.md §9.2)', () => {
    const seeded = startUpTimeline({ ...startUp(), start: { kind: 'new', inoculumMgNPerLPerDay: 0.5 } });
    expect(seeded.settled!).toBeLessThan(10);
  });
});

describe('free ammonia stalls nitrite oxidation at high pH and dose (Anthonisen et al. 1976)', () => {
  it('clears nitrite later at pH 8.4 than at 7.4 with 3 mg N/L a day, and later than a light dose at pH 8.4', () => {
    const high = startUpTimeline(startUp({ ph: 8.4 }, 3));
    const neutral = startUpTimeline(startUp({ ph: 7.4 }, 3));
    const light = startUpTimeline(startUp({ ph: 8.4 }, 0.5));
    const no2Settled = (x: typeof high) => settledBelowDay(x.f.series.days, [x.f.series.no2MgN], 0.2, x.no2Peak.day) ?? Infinity;
    expect(no2Settled(high)).toBeGreaterThan(no2Settled(neutral) + 3);
    expect(high.no2Peak.value).toBeGreaterThan(neutral.no2Peak.value);
    expect(no2Settled(high)).toBeGreaterThan(no2Settled(light));
  });
});

describe('a big addition to an established tank', () => {
  const tanPeakOf = (s: ScenarioInput) => forecast(s, { horizonDays: 45 }).summary.peaks.tan.value;
  const no2PeakOf = (s: ScenarioInput) => forecast(s, { horizonDays: 45 }).summary.peaks.no2.value;

  it('gives a TAN and a nitrite peak that grow with the size of the addition', () => {
    const add = (count: number) => matureWithPlaties(10, [{ type: 'add-fish', day: 1, fish: { species: 'platy', count } }]);
    const baseline = tanPeakOf(matureWithPlaties(10));
    expect(tanPeakOf(add(10))).toBeGreaterThan(baseline);
    expect(tanPeakOf(add(30))).toBeGreaterThan(tanPeakOf(add(10)));
    expect(no2PeakOf(add(30))).toBeGreaterThan(no2PeakOf(add(10)));
  });

  it('peaks lower when the same fish come in stages', () => {
    // The transient is the excess over the level the tank settles at with all 40 fish.
    const once = forecast(matureWithPlaties(10, [{ type: 'add-fish', day: 1, fish: { species: 'platy', count: 30 } }]), { horizonDays: 60 });
    const stages = [1, 8, 15].map((day) => ({ type: 'add-fish' as const, day, fish: { species: 'platy', count: 10 } }));
    const staged = forecast(matureWithPlaties(10, stages), { horizonDays: 60 });
    const settled = once.series.tanMgN[60];
    // Both settle to the same level within 2 % (the slow surfaces remember the path a little).
    expect(Math.abs(staged.series.tanMgN[60] - settled)).toBeLessThan(0.02 * settled);
    const excess = (f: typeof once) => f.summary.peaks.tan.value - settled;
    expect(excess(once)).toBeGreaterThan(0.05);
    expect(excess(staged)).toBeLessThan(0.75 * excess(once));
  });
});

describe('removal, starvation and restocking', () => {
  // 40 platies, 30 rehomed on day 1, 30 back on day 36. Feeding follows body mass.
  const removeAndRestock = (extra: ScenarioInput['events'] = []): ScenarioInput =>
    matureWithPlaties(40, [
      { type: 'remove-fish', day: 1, species: 'platy', count: 30 },
      { type: 'add-fish', day: 36, fish: { species: 'platy', count: 30 } },
      ...(extra ?? []),
    ]);
  const restockPeak = (s: ScenarioInput) => {
    const f = forecast(s, { horizonDays: 60, eventSampling: 'before' });
    const { days, tanMgN } = f.series;
    return { f, peak: peakOf(days.slice(37), tanMgN.slice(37)).value, ao: f.series.zones.reduce((s, z) => s + z.ao[35], 0) };
  };
  // Supplementary dose: what the 30 removed fish released, every day from day 1 to day 35.
  const massG = 30 * fishMassG({ species: 'platy', count: 1 }, DEFAULT_PARAMETERS.lengthWeightB);
  const flows = feedNitrogenFlows(massG, { mode: 'body-mass' }, DEFAULT_PARAMETERS);
  const dailyMgNPerL = (flows.excretedTan + flows.toOrg) / 100;

  it('lets the populations shrink toward the new load, so restocking spikes', () => {
    const kept = restockPeak(matureWithPlaties(40, [{ type: 'add-fish', day: 36, fish: { species: 'platy', count: 1 } }]));
    const starved = restockPeak(removeAndRestock());
    // A quarter of the food for 35 days: a partly starving film loses slowly (under 20 % in the
    // first 10 days without food, Ye et al.; MODEL.md §3.4), so about half remains.
    expect(starved.ao).toBeLessThan(0.65 * kept.ao);
    expect(starved.peak).toBeGreaterThan(0.3);
  });

  it('is mostly prevented by supplementary ammonia dosing at the old load in between', () => {
    const dosed = removeAndRestock([
      { type: 'ammonia-dose', day: 1, amount: { unit: 'mgN-per-L', value: dailyMgNPerL }, repeatEveryDays: 1, repeatCount: 35 },
    ]);
    // Spike = excess over the level a tank that kept its 40 fish holds (its settled TAN).
    const kept = forecast(matureWithPlaties(40), { horizonDays: 60 }).series.tanMgN[60];
    const without = restockPeak(removeAndRestock()).peak - kept;
    const withDosing = restockPeak(dosed).peak - kept;
    expect(without).toBeGreaterThan(0.05);
    expect(withDosing).toBeLessThan(0.3 * without);
  });
});

describe('conditions that slow the populations, and surface that raises the ceiling', () => {
  const base = startUp();
  const baseAo = aoAt(base, 10);

  it('less oxygen slows growth', () => {
    const lowO2 = startUp({ aeration: 'none', zones: [{ id: 'filter', kind: 'filter', media: { type: 'ceramic-rings', volumeL: 1 }, oxygen: 0.2 }, { id: 'surfaces', kind: 'surfaces', areaM2: 1.2, oxygen: 0.2 }] });
    expect(aoAt(lowO2, 10)).toBeLessThan(0.8 * baseAo);
  });

  it('less flow slows growth', () => {
    const lowFlow = startUp({ zones: [{ id: 'filter', kind: 'filter', media: { type: 'ceramic-rings', volumeL: 1 }, flow: 0.1 }, { id: 'surfaces', kind: 'surfaces', areaM2: 1.2, flow: 0.1 }] });
    expect(aoAt(lowFlow, 10)).toBeLessThan(0.8 * baseAo);
  });

  it('more light on the colonised surface slows growth', () => {
    const dark = startUp({ zones: [{ id: 'surfaces', kind: 'surfaces', areaM2: 2, light: 0 }] });
    const lit = startUp({ zones: [{ id: 'surfaces', kind: 'surfaces', areaM2: 2, light: 1 }], lightHoursPerDay: 12 });
    expect(aoAt(lit, 10)).toBeLessThan(0.8 * aoAt(dark, 10));
  });

  it('lower temperature slows growth', () => {
    expect(aoAt(startUp({ temperatureC: 20 }), 10)).toBeLessThan(0.8 * baseAo);
  });

  it('lower pH slows growth (US EPA 1975 pH factor)', () => {
    expect(aoAt(startUp({ ph: 6.8 }), 10)).toBeLessThan(0.8 * baseAo);
  });

  it('more suitable surface raises the ceiling', () => {
    const heavy = (areaM2: number): ScenarioInput => ({
      tank: tank({ zones: [{ id: 'filter', kind: 'filter', areaM2 }] }),
      start: { kind: 'new', inoculumMgNPerLPerDay: 0.1 },
      events: [{ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 3 }, repeatEveryDays: 1 }],
    });
    const small = forecast(heavy(0.2), before).summary.final;
    const large = forecast(heavy(0.8), before).summary.final;
    expect(small.aoMgNPerDay).toBeGreaterThan(0.8 * small.zones[0].aoCeilingMgNPerDay); // ceiling-limited
    expect(large.aoMgNPerDay).toBeGreaterThan(2 * small.aoMgNPerDay);
  });
});

describe('water changes', () => {
  it('dilute dissolved species exactly and leave attached nitrifiers alone', () => {
    const s: ScenarioInput = {
      ...matureWithPlaties(20, [{ type: 'ammonia-dose', day: 2, amount: { unit: 'mgN-per-L', value: 2 } }, { type: 'water-change', day: 3, percent: 40 }], {
        tapWater: { tanMgN: 0.1, no2MgN: 0, no3MgN: 5 },
      }),
      initialWater: { no3MgN: 30 },
    };
    const pre = forecast(s, { horizonDays: 5, eventSampling: 'before' }).series;
    const post = forecast(s, { horizonDays: 5, eventSampling: 'after' }).series;
    const d = 3;
    expect(post.tanMgN[d]).toBeCloseTo(0.6 * pre.tanMgN[d] + 0.4 * 0.1, 12);
    expect(post.no2MgN[d]).toBeCloseTo(0.6 * pre.no2MgN[d], 12);
    expect(post.no3MgN[d]).toBeCloseTo(0.6 * pre.no3MgN[d] + 0.4 * 5, 12);
    expect(post.orgMgN[d]).toBeCloseTo(0.6 * pre.orgMgN[d], 12);
    post.zones.forEach((z, i) => {
      expect(z.ao[d]).toBe(pre.zones[i].ao[d]);
      expect(z.no[d]).toBe(pre.zones[i].no[d]);
    });
  });

  it('filter rinsing removes the stated share of that zone only', () => {
    const s = matureWithPlaties(20, [{ type: 'filter-clean', day: 2, zoneId: 'filter', action: 'rinse', shareLost: 0.25 }]);
    const pre = forecast(s, { horizonDays: 3, eventSampling: 'before' }).series.zones;
    const post = forecast(s, { horizonDays: 3, eventSampling: 'after' }).series.zones;
    expect(post[0].ao[2]).toBeCloseTo(0.75 * pre[0].ao[2], 10);
    expect(post[1].ao[2]).toBe(pre[1].ao[2]);
  });
});

describe('medication and aeration loss', () => {
  it('a medication that halves activity raises TAN while it acts, then lets it fall', () => {
    const s = matureWithPlaties(30, [{ type: 'medication', day: 2, durationDays: 5, oxidationMultiplier: 0.3 }]);
    const tan = forecast(s, { horizonDays: 20 }).series.tanMgN;
    expect(tan[6]).toBeGreaterThan(1.5 * tan[1]);
    expect(tan[19]).toBeLessThan(tan[7]);
  });

  it('losing aeration raises TAN', () => {
    const calm = forecast(matureWithPlaties(30), { horizonDays: 6 }).series.tanMgN[5];
    const loss = forecast(matureWithPlaties(30, [{ type: 'aeration-loss', day: 2, durationDays: 4, oxygenShare: 0.1 }]), { horizonDays: 6 }).series.tanMgN[5];
    expect(loss).toBeGreaterThan(1.5 * calm);
  });
});
