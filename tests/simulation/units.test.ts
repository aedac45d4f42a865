import { describe, expect, it } from 'vitest';
import { feedNitrogenFlows, fishMassG, massFromLength, tanFromFeed } from '@/simulation/bioload';
import {
  ammoniaSolutionForDose,
  ammoniaSolutionMgNPerMl,
  ammoniaSolutionToMgNPerL,
  ammoniumChlorideForDose,
  ammoniumChlorideToMgNPerL,
  NH4CL_N_SHARE,
} from '@/simulation/dosing';
import { DEFAULT_PARAMETERS } from '@/simulation/parameters';
import {
  asNFactor,
  celsiusToFahrenheit,
  dkhToMgCaCO3,
  fahrenheitToCelsius,
  ionToN,
  litresToUsGallons,
  MOLAR_MASS,
  mgCaCO3ToDkh,
  nToIon,
  usGallonsToLitres,
} from '@/simulation/units';
import { expectClose } from './helpers';

describe('unit constants (MODEL.md §4.6; IUPAC molar masses)', () => {
  it('has the molar masses of MODEL.md §4.6', () => {
    expect(MOLAR_MASS).toMatchObject({ N: 14.007, NH3: 17.031, NH4: 18.039, NO2: 46.005, NO3: 62.004, NH4Cl: 53.489 });
  });

  it('gives the as-ion → as-N factors 0.8224, 0.7765, 0.3045, 0.2259', () => {
    expect(asNFactor('NH3').toFixed(4)).toBe('0.8224');
    expect(asNFactor('NH4').toFixed(4)).toBe('0.7765');
    expect(asNFactor('NO2').toFixed(4)).toBe('0.3045');
    expect(asNFactor('NO3').toFixed(4)).toBe('0.2259');
  });

  it('converts as-ion ↔ as-N both ways', () => {
    expectClose(ionToN(50, 'NO3'), 50 * 0.22590, 1e-4);
    expectClose(nToIon(ionToN(3.3, 'NO2'), 'NO2'), 3.3, 1e-15);
  });

  it('uses 1 US gal = 3.785411784 L exactly (NIST)', () => {
    expect(usGallonsToLitres(1)).toBe(3.785411784);
    expectClose(litresToUsGallons(usGallonsToLitres(29)), 29, 1e-15);
  });

  it('converts °C ↔ °F (°F = °C·9/5 + 32)', () => {
    expect(celsiusToFahrenheit(25)).toBe(77);
    expect(fahrenheitToCelsius(212)).toBe(100);
  });

  it('uses 1 °dKH = 17.848 mg/L CaCO3', () => {
    expect(dkhToMgCaCO3(1)).toBe(17.848);
    expectClose(mgCaCO3ToDkh(dkhToMgCaCO3(6.5)), 6.5, 1e-15);
  });
});

describe('dosing stoichiometry (NH4Cl 53.489 g/mol, N 14.007)', () => {
  it('NH4Cl is 26.19 % N (MODEL.md §4.6)', () => {
    expect((100 * NH4CL_N_SHARE).toFixed(2)).toBe('26.19');
  });

  it('1 g NH4Cl in 100 L gives 2.619 mg N/L, and back', () => {
    expectClose(ammoniumChlorideToMgNPerL(1, 100), (1000 * 14.007) / 53.489 / 100, 1e-12);
    expectClose(ammoniumChlorideForDose(2, 100), (2 * 100) / 1000 / (14.007 / 53.489), 1e-12);
  });

  it('an ammonia solution delivers density × %NH3 × 14.007/17.031 per mL', () => {
    // 10 % w/w at 0.96 g/mL: 96 mg NH3/mL → 78.95 mg N/mL (stoichiometry).
    expectClose(ammoniaSolutionMgNPerMl({ percentNH3: 10 }), (96 * 14.007) / 17.031, 1e-12);
    expectClose(ammoniaSolutionMgNPerMl({ percentNH3: 25, densityGPerMl: 0.91 }), (227.5 * 14.007) / 17.031, 1e-12);
    const ml = ammoniaSolutionForDose(1, { percentNH3: 10 }, 200);
    expectClose(ammoniaSolutionToMgNPerL(ml, { percentNH3: 10 }, 200), 1, 1e-12);
  });

  it('refuses impossible inputs with a RangeError', () => {
    expect(() => ammoniumChlorideToMgNPerL(1, 0)).toThrow(RangeError);
    expect(() => ammoniaSolutionMgNPerMl({ percentNH3: 50 })).toThrow(RangeError);
  });
});

describe('bioload (Timmons & Ebeling; Froese 2006)', () => {
  it('1 kg feed at 45 % protein gives 41.4 g TAN-N', () => {
    // Timmons & Ebeling: feed × protein × 0.092.
    expectClose(tanFromFeed(1000, 0.45), 41.4, 1e-12);
  });

  it('computes mass from length W = a·L^b', () => {
    // Froese 2006 form; a = 0.01, b = 3.03 (median b): a 5 cm fish weighs 1.31 g.
    expectClose(massFromLength(5, 0.01, 3.03), 0.01 * Math.pow(5, 3.03), 1e-15);
    expect(fishMassG({ species: 'neon-tetra', count: 1 }, 3.03)).toBeGreaterThan(0.1);
    expect(fishMassG({ name: 'my fish', count: 1, massG: 2.5 }, 3.03)).toBe(2.5);
  });

  it('halving the fish at constant grams of food does not halve the nitrogen load', () => {
    // MODEL.md §6.2: uneaten food becomes detritus and is released as TAN in the end.
    const p = DEFAULT_PARAMETERS;
    const feeding = { mode: 'grams' as const, gramsPerDay: 1, proteinShare: 0.45 };
    const full = feedNitrogenFlows(40, feeding, p);
    const half = feedNitrogenFlows(20, feeding, p);
    const supply = (f: typeof full) => f.excretedTan + f.toOrg;
    expect(half.excretedTan).toBeLessThan(full.excretedTan);
    expect(supply(half)).toBeGreaterThan(0.9 * supply(full));
    // and every flow adds up to the food's N
    expectClose(full.excretedTan + full.toOrg + full.retained, full.offeredN, 1e-12);
  });
});
