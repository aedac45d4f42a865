import { describe, expect, it } from 'vitest';
import {
  ammoniaPKa,
  carbonateCo2,
  carbonateCo2RuleOfThumb,
  carbonatePK1,
  epaAcuteTan,
  epaChronicTan,
  freeAmmoniaFraction,
  freeAmmoniaMgNH3,
  oxygenSaturation,
  phFromCarbonate,
} from '@/simulation/chemistry';
import { freeAmmoniaLimitAsTan, limitRecord, nitriteLimitFromChloride, tankLimits, type LimitChoices, type LimitConditions } from '@/simulation/limits';

/** The limits by key, through the one picker (simulation/limits.ts `tankLimits`). */
const limitsAt = (c: LimitConditions, choices?: LimitChoices) => limitRecord(tankLimits(c, choices), c);
import { expectClose, sig } from './helpers';

describe('free-ammonia fraction (Emerson et al. 1975)', () => {
  it('matches the check values of MODEL.md §4.1 to 4 significant digits', () => {
    // Emerson et al. 1975 formula; check values as listed in MODEL.md §4.1 (4 s.f.).
    expectClose(freeAmmoniaFraction(25, 7.0), 0.00564, 0, 1.5e-6);
    expectClose(freeAmmoniaFraction(20, 8.0), 0.03807, 0, 5e-6);
    expectClose(freeAmmoniaFraction(28, 7.5), 0.02164, 0, 5e-6);
  });

  it('gives free ammonia as the molecule: mg N/L × fraction × 17.031/14.007 (molar masses, IUPAC)', () => {
    // 2 mg TAN-N/L at 25 °C, pH 7.0: 2 × 0.00564 × 1.2159 ≈ 0.01372 mg NH3/L.
    expectClose(freeAmmoniaMgNH3(2, 25, 7.0), 2 * freeAmmoniaFraction(25, 7.0) * (17.031 / 14.007), 1e-12, 0);
    expectClose(freeAmmoniaMgNH3(2, 25, 7.0), 0.01372, 0, 2e-5);
    expect(freeAmmoniaMgNH3(0, 25, 8)).toBe(0);
  });

  it('reproduces the UF/IFAS EDIS FA16 table to its 2 significant digits', () => {
    // Francis-Floyd et al., EDIS FA16, table from Emerson's data.
    const table: [number, number, number][] = [
      [7.0, 20, 0.0039],
      [7.0, 26, 0.006],
      [7.0, 28, 0.0069],
      [8.0, 20, 0.0381],
      [8.0, 26, 0.0574],
      [8.0, 28, 0.0654],
    ];
    for (const [ph, t, f] of table) expect(sig(freeAmmoniaFraction(t, ph), 2)).toBe(sig(f, 2));
  });

  it('uses pKa = 0.09018 + 2729.92/T', () => {
    // Emerson et al. 1975: pKa at 25 °C = 0.09018 + 2729.92/298.15.
    expectClose(ammoniaPKa(25), 0.09018 + 2729.92 / 298.15, 1e-15);
  });
});

describe('US EPA (2013) ammonia criteria, EPA-822-R-13-001', () => {
  it('gives the headline CMC 17 and CCC 1.9 mg TAN-N/L at pH 7, 20 °C (computed 16.76, 1.887)', () => {
    expectClose(epaAcuteTan(7, 20), 16.76, 0, 0.005);
    expectClose(epaChronicTan(7, 20), 1.887, 0, 0.0005);
    expect(sig(epaAcuteTan(7, 20), 2)).toBe(17);
    expect(sig(epaChronicTan(7, 20), 2)).toBe(1.9);
  });

  it('gives CCC 1.367 at pH 7, 25 °C and CMC 2.58 / CCC 0.563 at pH 8, 25 °C', () => {
    // EPA 2013 values as listed in MODEL.md §4.5.
    expectClose(epaChronicTan(7, 25), 1.367, 0, 0.0005);
    expectClose(epaAcuteTan(8, 25), 2.58, 0, 0.005);
    expectClose(epaChronicTan(8, 25), 0.563, 0, 0.0005);
  });

  it('holds the chronic criterion flat below 7 °C (max(T, 7) in EPA 2013)', () => {
    expect(epaChronicTan(7.5, 3)).toBe(epaChronicTan(7.5, 7));
  });
});

describe('oxygen saturation (Benson & Krause 1984; APHA; EN 25814 table)', () => {
  it('gives 9.09 / 8.26 / 7.83 mg/L at 20 / 25 / 28 °C', () => {
    expect(oxygenSaturation(20).toFixed(2)).toBe('9.09');
    expect(oxygenSaturation(25).toFixed(2)).toBe('8.26');
    expect(oxygenSaturation(28).toFixed(2)).toBe('7.83');
  });
});

describe('carbonate system (Plummer & Busenberg 1982)', () => {
  it('gives pK1 6.38 / 6.35 / 6.34 at 20 / 25 / 28 °C', () => {
    expect(carbonatePK1(20).toFixed(2)).toBe('6.38');
    expect(carbonatePK1(25).toFixed(2)).toBe('6.35');
    expect(carbonatePK1(28).toFixed(2)).toBe('6.34');
  });

  it('round-trips pH through CO2 = 15.66·KH·10^(pK1 − pH)', () => {
    const co2 = carbonateCo2(4, 7.2, 25);
    expectClose(phFromCarbonate(4, co2, 25), 7.2, 1e-12);
  });

  it('reads the trade rule of thumb about 10–20 % low against the formula (MODEL.md §4.3)', () => {
    // MODEL.md §4.3: CO2 ≈ 3·KH·10^(7−pH) [practice] reads 10–20 % low (20.5 % at 20 °C).
    for (const t of [20, 25, 28]) {
      const ratio = carbonateCo2RuleOfThumb(4, 7) / carbonateCo2(4, 7, t);
      expect(ratio).toBeGreaterThan(0.79);
      expect(ratio).toBeLessThan(0.9);
    }
  });
});

describe('limits', () => {
  it('converts the CCME free-ammonia guideline to TAN at pH and temperature', () => {
    // CCME 0.019 mg NH3/L; Emerson fraction 0.005639 at 25 °C, pH 7.0.
    const tan = freeAmmoniaLimitAsTan(0.019, 7, 25);
    expectClose(tan, (0.019 * 14.007) / 17.031 / freeAmmoniaFraction(25, 7), 1e-12);
    expect(tan).toBeGreaterThan(2.7);
    expect(tan).toBeLessThan(2.8);
  });

  it('gives the chloride-based nitrite limit at a 16:1 molar ratio (Tomasso et al. 1979)', () => {
    // 35.453 mg Cl/L = 1 mmol; /16 = 0.0625 mmol NO2 = 0.8754 mg N/L.
    expectClose(nitriteLimitFromChloride(35.453), (14.007 / 16), 1e-12);
  });

  it('defaults to 0.1 mg N/L nitrite (Boyd) and states every basis and source', () => {
    const limits = limitsAt({ ph: 7, temperatureC: 20 });
    expect(limits.nitrite.value).toBe(0.1);
    expect(limits.freeNh3.value).toBe(0.019);
    expectClose(limits.tanChronic.value, 1.887, 0, 0.0005); // EPA 2013 at pH 7, 20 °C
    for (const limit of Object.values(limits)) {
      expect(limit.source.length).toBeGreaterThan(5);
      expect(limit.basis.length).toBeGreaterThan(5);
    }
    const eifac = limitsAt({ ph: 7, temperatureC: 20 }, { freeAmmoniaGuideline: 'eifac' });
    expect(eifac.freeNh3.value).toBe(0.025); // EIFAC 1970 (value from memory)
    const chloride = limitsAt({ ph: 7, temperatureC: 20, chlorideMgL: 20 }, { nitriteBasis: 'chloride' });
    expectClose(chloride.nitrite.value, nitriteLimitFromChloride(20), 1e-15);
    expect(() => limitsAt({ ph: 7, temperatureC: 20 }, { nitriteBasis: 'chloride' })).toThrow(/chlorideMgL/);
  });
});
