/**
 * The engine against published measurements (MODEL.md §9). Each check names its source and
 * how far it was read (simulation/SOURCES.md: abstracts and first pages — "M" there); where
 * a figure could not be confirmed the check says so and tests the shape, not the number.
 * Tolerances are our own judgement unless the source gives a range.
 */
import { describe, expect, it } from 'vitest';
import { forecast, type Forecast } from '@/simulation/forecast';
import { KIT_FIRST_STEP_MG_N } from '@/simulation/forecast/spare-capacity';
import { zonesFromDescription, type TankDescription } from '@/simulation/presets';
import { ScenarioError, type ScenarioInput } from '@/simulation/scenario';
import { peakOf } from '@/simulation/series-stats';

type Tank = ScenarioInput['tank'];

/** An invented 120 L community tank: canister with 1.5 L ceramic rings, 5 cm sand, some rock. */
function tankOf(over: Partial<TankDescription> = {}, water: Partial<Tank> = {}): Tank {
  const d: TankDescription = { volumeL: 120, filter: { kind: 'canister', mediaVolumeL: 1.5 }, substrate: { grain: 'sand', depthCm: 5 }, hardscape: 'some', ...over };
  const { zones, aeration } = zonesFromDescription(d);
  return { volumeL: 120, temperatureC: 25, ph: 7.2, zones, aeration, ...water };
}
const neons = (count: number) => [{ species: 'neon-tetra', count }];
const settledTank = (events: ScenarioInput['events'] = [], over: Partial<TankDescription> = {}, water: Partial<Tank> = {}): ScenarioInput => ({
  tank: tankOf(over, water),
  start: { kind: 'mature' },
  fish: neons(30),
  events,
});
/** A fishless start-up dosed `mgN` mg N/L a day, read before each day's dose. */
const startUp = (water: Partial<Tank> = {}, mgN = 1, over: Partial<TankDescription> = {}): ScenarioInput => ({
  tank: tankOf(over, water),
  start: { kind: 'new' },
  events: [{ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: mgN }, repeatEveryDays: 1 }],
});
const run = (s: ScenarioInput, horizonDays = 60): Forecast => forecast(s, { horizonDays, eventSampling: 'before' });
const total = (f: Forecast, key: 'ao' | 'no', k: number) => f.series.zones.reduce((sum, z) => sum + z[key][k], 0);
/** First sample day from which TAN and nitrite both stay below `level` to the end. */
function clearFrom(f: Forecast, level = 0.2): number {
  const { days, tanMgN, no2MgN } = f.series;
  for (let k = days.length - 1; k >= 0; k--) if (tanMgN[k] >= level || no2MgN[k] >= level) return k + 1 < days.length ? days[k + 1] : Infinity;
  return days[0];
}

describe('start-up of an unseeded tank', () => {
  it('clears within 20–49 days at 25 °C (6–7 weeks in a pilot RAS, Mnyoro et al. 2022, J. Cleaner Prod. 366:132929; 20–40 days, Lekang — unconfirmed)', () => {
    const day = clearFrom(run(startUp(), 90));
    expect(day).toBeGreaterThanOrEqual(20);
    expect(day).toBeLessThanOrEqual(49);
  });

  it('settles nitrite oxidisers days after ammonia oxidisers at 20 °C (about 30 d, then 8 d more: Elawwad et al. 2012, fixed beds, abstract)', () => {
    const f = run(startUp({ temperatureC: 20 }), 120);
    const last = f.series.days.length - 1;
    const reached = (key: 'ao' | 'no') => f.series.days[f.series.days.findIndex((_, k) => total(f, key, k) >= 0.9 * total(f, key, last))];
    const lag = reached('no') - reached('ao');
    // Shape only: the wastewater loads and sludge inoculum of the source are far from a tank's.
    expect(lag).toBeGreaterThanOrEqual(2);
    expect(lag).toBeLessThanOrEqual(20);
  });

  it('clears sooner at 28 °C than at 20 °C (warmer water speeds nitrifier growth; common practice)', () => {
    expect(clearFrom(run(startUp({ temperatureC: 28 }), 120))).toBeLessThan(clearFrom(run(startUp({ temperatureC: 20 }), 120)));
  });
});

describe('starvation (Ye, Hu, Poussade, Keller & Yuan, MBBR starvation study — journal unconfirmed, abstract)', () => {
  const starved = run(settledTank([{ type: 'remove-fish', day: 0, species: 'neon-tetra', count: 30 }]), 40);
  const left = (key: 'ao' | 'no', day: number) => total(starved, key, day) / total(starved, key, 0);

  it('keeps at least 80 % of both populations after 10 days without fish ("< 20 % loss within 10 days")', () => {
    expect(left('ao', 10)).toBeGreaterThanOrEqual(0.8);
    expect(left('no', 10)).toBeGreaterThanOrEqual(0.8);
  });

  it('has lost 60–80 % of both after 30 days ("60–80 % when starvation was longer than 20 days")', () => {
    for (const key of ['ao', 'no'] as const) {
      expect(1 - left(key, 30)).toBeGreaterThanOrEqual(0.6);
      expect(1 - left(key, 30)).toBeLessThanOrEqual(0.8);
    }
  });

  it('starts clearing a dose within 12 hours after 10 days starved (activity back within minutes to ~12 h: Bollmann et al. 2005; Manser et al. 2006)', () => {
    const f = forecast(settledTank([
      { type: 'remove-fish', day: 0, species: 'neon-tetra', count: 30 },
      { type: 'ammonia-dose', day: 10, amount: { unit: 'mgN-per-L', value: 1 } },
    ]), { horizonDays: 12, stepDays: 0.25 });
    const k = (d: number) => f.series.days.findIndex((x) => x >= d - 1e-9);
    const atDose = f.series.tanMgN[k(10)];
    expect(f.series.tanMgN[k(10.5)]).toBeLessThan(0.95 * atDose);
  });
});

describe('attached-film kinetics at fixed capacity (one zone, capacity held)', () => {
  // Capacity held fixed: no growth or loss, so the rate law alone is seen.
  const frozen = { muMaxAo: 1e-12, decayAo: 0, yieldAo: 0, muMaxNo: 1e-12, decayNo: 0, yieldNo: 0, immigration: 0, starveLossEarly: 0, starveLossLate: 0 };
  const rateAt = (tan: number, aeration: Tank['aeration'] = 'strong') => {
    const s: ScenarioInput = {
      tank: { volumeL: 100, temperatureC: 25, ph: 7.5, aeration, zones: [{ id: 'f', kind: 'filter', areaM2: 1, flow: 1, oxygen: 1, light: 0 }] },
      // A full film (at its ceiling) is oxygen-limited when TAN is high; a thin one is not.
      start: { kind: 'explicit', capacities: [{ zoneId: 'f', aoMgNPerDay: 500 * 1.072 ** 1, noMgNPerDay: 0 }] },
      initialWater: { tanMgN: tan },
    };
    const f = forecast(s, { horizonDays: 1 / 96, stepDays: 1 / 96, parameters: frozen });
    return ((tan - f.series.tanMgN[1]) * 100) / (1 / 96);
  };

  it('is close to first order from 0.1 to 0.5 mg N/L (linear through zero: Malone, Bergeron & Cristina 2006; first order below ~1 mg/L: Ebeling & Wheaton 2006)', () => {
    const xs = [0.1, 0.2, 0.3, 0.4, 0.5];
    const ys = xs.map((x) => rateAt(x));
    const slope = xs.reduce((s, x, i) => s + x * ys[i], 0) / xs.reduce((s, x) => s + x * x, 0);
    const mean = ys.reduce((a, b) => a + b, 0) / ys.length;
    const ssRes = ys.reduce((s, y, i) => s + (y - slope * xs[i]) ** 2, 0);
    const ssTot = ys.reduce((s, y) => s + (y - mean) ** 2, 0);
    expect(1 - ssRes / ssTot).toBeGreaterThanOrEqual(0.95);
  });

  it('saturates above ~1–2 mg N/L and is capped by oxygen (O2:NH4-N below 3.4 limits a film: Tanaka & Dunn 1982)', () => {
    expect(rateAt(5) / rateAt(2.5)).toBeLessThan(1.1);
    // Weak aeration lowers the capped rate of a loaded film by at least a tenth …
    expect(rateAt(5, 'none')).toBeLessThan(0.9 * rateAt(5, 'strong'));
    // … but barely matters at a settled tank's ammonia, where DO/TAN ≫ 3.4.
    expect(rateAt(0.1, 'none')).toBeGreaterThan(0.9 * rateAt(0.1, 'strong'));
  });
});

describe('settled tanks', () => {
  const settled = run(settledTank());

  it('read clean: TAN and nitrite below a kit\'s first step and below half of each limit, 0 days over (common practice)', () => {
    const s = settled.summary;
    expect(s.peaks.tan.value).toBeLessThan(KIT_FIRST_STEP_MG_N.tan);
    expect(s.peaks.no2.value).toBeLessThan(KIT_FIRST_STEP_MG_N.no2);
    expect(s.peaks.tan.value).toBeLessThan(0.5 * s.limits.tanChronic.value);
    expect(s.peaks.no2.value).toBeLessThan(0.5 * s.limits.nitrite.value);
    expect(Object.values(s.daysOver).every((x) => x.days === 0)).toBe(true);
  });

  it('settle at a floor near 0.07 mg TAN/L at light loads and rise with load (Zhu & Chen 1999 threshold 0.07 mg/L at 27.2 °C; shape only, units of their rate unconfirmed)', () => {
    const tanAt = (load: number) =>
      forecast({ tank: { volumeL: 100, temperatureC: 27.2, ph: 7.5, aeration: 'strong', zones: [{ id: 'f', kind: 'filter', media: { type: 'ceramic-rings', volumeL: 1 } }] }, start: { kind: 'mature', loadMgNPerDay: load } }, { horizonDays: 1 }).series.tanMgN[0];
    const loads = [2, 5, 10, 20, 40];
    const tans = loads.map(tanAt);
    expect(tans[0]).toBeGreaterThan(0.03);
    expect(tans[0]).toBeLessThan(0.15);
    for (let i = 1; i < tans.length; i++) expect(tans[i]).toBeGreaterThan(tans[i - 1]);
  });

  it('keep nitrite to ammonia in about the same ratio at half, one and two times the stocking (Nijhof & Klapwijk 1995, abstract; ±30 %)', () => {
    const ratio = (n: number) => {
      const f = forecast({ ...settledTank(), fish: neons(n) }, { horizonDays: 1 });
      return f.series.no2MgN[0] / f.series.tanMgN[0];
    };
    const r = [15, 30, 60].map(ratio);
    for (const x of r) expect(Math.abs(x / r[1] - 1)).toBeLessThan(0.3);
  });

  it('carry most nitrification in the filter (≥ 81–86 % in three freshwater aquaria: Bagchi et al. 2014)', () => {
    const f = settled;
    const filter = f.series.zones.find((z) => z.zoneId === 'filter')!;
    expect(filter.ao[0] / total(f, 'ao', 0)).toBeGreaterThanOrEqual(0.8);
  });

  it('hold some of each population on every surface, so no zone starts empty (colonisation, MODEL.md §3.5)', () => {
    for (const z of settled.series.zones) {
      expect(z.ao[0]).toBeGreaterThan(0);
      expect(z.no[0]).toBeGreaterThan(0);
    }
  });

  it('keep their areal rate under 0.69 g N per m² a day at 24 °C (Nijhof & Bovendeur 1990, fresh-water value)', () => {
    const f = forecast({ tank: { volumeL: 100, temperatureC: 24, ph: 7.5, aeration: 'strong', zones: [{ id: 'f', kind: 'filter', areaM2: 0.5, flow: 1, oxygen: 1, light: 0 }] }, start: { kind: 'mature', loadMgNPerDay: 150 } }, { horizonDays: 10 });
    expect(f.summary.final.zones[0].aoCeilingMgNPerDay / 0.5).toBeLessThanOrEqual(690);
    expect(f.summary.final.aoMgNPerDay / 0.5).toBeLessThanOrEqual(690);
  });
});

describe('spare capacity (derived, MODEL.md §3.3; "mini-cycles" after big additions are common practice)', () => {
  const settled = run(settledTank());
  const spare = settled.summary.spareCapacity!;
  const peakAfterTimes = (times: number) => run(settledTank([{ type: 'add-fish', day: 1, fish: { species: 'neon-tetra', count: Math.round(30 * (times - 1)) } }])).summary.peaks.tan.value;

  it('is stated for a settled tank, between 1.3 and 5 times today\'s load', () => {
    expect(spare.showsFirst).toBe('ammonia');
    expect(spare.times).toBeGreaterThan(1.3);
    expect(spare.times).toBeLessThan(5);
  });

  it('means what it says: a smaller addition stays under a kit\'s first step, a clearly larger one shows', () => {
    expect(peakAfterTimes(Math.max(1.2, spare.times - 1))).toBeLessThan(KIT_FIRST_STEP_MG_N.tan);
    expect(peakAfterTimes(spare.times + 1.5)).toBeGreaterThan(KIT_FIRST_STEP_MG_N.tan);
  });
});

describe('replacing all filter media (common practice; SRAC 4502: nitrifiers live on all wet surfaces)', () => {
  const replace = (hardscape: TankDescription['hardscape'], substrate: TankDescription['substrate']) =>
    run(settledTank([{ type: 'filter-clean', day: 1, zoneId: 'filter', action: 'replace', shareLost: 1 }], { hardscape, substrate }), 90);

  it('gives a mini-cycle, then recovers within the start-up window', () => {
    const f = replace('some', { grain: 'sand', depthCm: 5 });
    expect(f.summary.peaks.tan.value).toBeGreaterThan(KIT_FIRST_STEP_MG_N.tan);
    expect(clearFrom(f)).toBeLessThanOrEqual(49);
  });

  it('peaks lower in a tank rich in rock, wood and substrate than in a bare one', () => {
    const rich = replace('lots', { grain: 'gravel', depthCm: 8 });
    const bare = replace('none', 'bare');
    expect(rich.summary.peaks.tan.value).toBeLessThan(bare.summary.peaks.tan.value);
  });
});

describe('a new tank seeded with mature media (SRAC 4502: moving media from an acclimated system is the most effective start; 2 weeks with backwash sludge, Štembal et al. — authors unconfirmed)', () => {
  it('with half its filter from a mature one, holds the fish it is stocked with under 0.2 mg N/L from day 7 on (≤ 7 days is our judgement)', () => {
    const f = forecast({ tank: tankOf(), start: { kind: 'seeded', share: 0.5 }, fish: neons(30), events: [] }, { horizonDays: 30, stepDays: 0.25 });
    const { days, tanMgN, no2MgN } = f.series;
    days.forEach((d, k) => {
      if (d >= 7) {
        expect(tanMgN[k]).toBeLessThan(0.2);
        expect(no2MgN[k]).toBeLessThan(0.2);
      }
    });
  });

  it('clears sooner than the same tank started unseeded', () => {
    const seeded = run({ ...startUp(), start: { kind: 'seeded', share: 0.5, loadMgNPerDay: 100 } }, 90);
    expect(clearFrom(seeded)).toBeLessThan(clearFrom(run(startUp(), 90)));
  });
});

describe('free ammonia stalls nitrite oxidation (Anthonisen et al. 1976, via secondary sources: onset 0.1–1.0 mg/L)', () => {
  it('makes the nitrite phase of a heavily dosed start-up last longer at pH 8.2 than at pH 7.0 (≥ 1.3×)', () => {
    const phase = (ph: number) => {
      const f = run(startUp({ ph, temperatureC: 28 }, 4), 90);
      const { days, tanMgN, no2MgN } = f.series;
      const tanDone = days.find((d, k) => k > 0 && tanMgN[k] < 0.2 && days[k] > peakOf(days, tanMgN).day);
      const no2Done = days.find((d, k) => k > 0 && no2MgN[k] < 0.2 && days[k] > peakOf(days, no2MgN).day);
      return (no2Done ?? Infinity) - (tanDone ?? 0);
    };
    expect(phase(8.2)).toBeGreaterThanOrEqual(1.3 * phase(7.0));
  });
});

describe('soft, acid water (acid-adapted films nitrify: Tarre & Green 2004; acidophilic ammonia oxidisers: Lehtovirta-Morley et al. 2011)', () => {
  it('accepts a settled tank at pH 6.0 and 5.5 whose water stays under half its limits', () => {
    for (const ph of [6.0, 5.5]) {
      const f = run(settledTank([], {}, { ph }));
      expect(f.summary.peaks.tan.value).toBeLessThan(0.5 * f.summary.limits.tanChronic.value);
      expect(f.summary.peaks.no2.value).toBeLessThan(0.5 * f.summary.limits.nitrite.value);
    }
  });

  it('names the pH, not the fish, when acid water is why a stocking cannot be carried', () => {
    const refusal = (ph: number) => {
      try {
        forecast({ ...settledTank([], {}, { ph }), fish: neons(200) }, { horizonDays: 1 });
        return null;
      } catch (e) {
        return e instanceof ScenarioError ? Object.keys(e.fields) : ['not a ScenarioError'];
      }
    };
    expect(refusal(7.2)).toBeNull();
    expect(refusal(4.5)).toEqual(['tank.ph']);
  });

  it('nitrifies more slowly in acid water: a new tank at pH 6.0 clears later than at pH 7.5', () => {
    expect(clearFrom(run(startUp({ ph: 6.0 }), 120), 0.2)).toBeGreaterThan(clearFrom(run(startUp({ ph: 7.5 }), 120), 0.2));
  });
});
