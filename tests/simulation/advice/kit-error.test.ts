import { describe, expect, it } from 'vitest';
import { readingSigma, roundToKit, scaledResidual } from '../../../simulation/advice/kit-error';

const kit = { stepMgN: 0.25, relativeError: 0.1 };

describe('readingSigma', () => {
  it('is the rounding error h/√12 of a uniform step at a zero value (variance of a uniform distribution)', () => {
    expect(readingSigma(kit, 0)).toBeCloseTo(0.25 / Math.sqrt(12), 12);
  });

  it('adds the relative term in quadrature', () => {
    const expected = Math.sqrt((0.25 / Math.sqrt(12)) ** 2 + 0.2 ** 2);
    expect(readingSigma(kit, 2)).toBeCloseTo(expected, 12);
  });
});

describe('scaledResidual', () => {
  it('costs nothing for a "0" reading while the model stays below half the first step', () => {
    expect(scaledResidual(kit, 0, 0.1)).toBe(0);
  });

  it('penalises a "0" reading only for the model\'s excess over half the first step', () => {
    const r = scaledResidual(kit, 0, 0.625);
    expect(r).toBeCloseTo(-0.5 / readingSigma(kit, 0.625), 12);
  });

  it('scales an ordinary reading by σ at the modelled value', () => {
    expect(scaledResidual(kit, 1, 0.5)).toBeCloseTo(0.5 / readingSigma(kit, 0.5), 12);
  });
});

describe('roundToKit', () => {
  it('rounds to the nearest swatch and never below zero', () => {
    expect(roundToKit(kit, 0.37)).toBe(0.25);
    expect(roundToKit(kit, 0.38)).toBe(0.5);
    expect(roundToKit(kit, -0.1)).toBe(0);
  });
});
