import { describe, expect, it } from 'vitest';
import { tankLimits } from '../../../simulation/advice/tank-limits';

const byKey = (ls: ReturnType<typeof tankLimits>, k: string) => ls.find((l) => l.key === k)!;

describe('tankLimits', () => {
  it('gives the EPA 2013 criteria at the tank\'s pH and temperature (EPA-822-R-13-001: CCC 1.887, CMC 16.76 at pH 7, 20 °C)', () => {
    const ls = tankLimits({ ph: 7, temperatureC: 20 });
    expect(byKey(ls, 'tanChronic').value).toBeCloseTo(1.887, 2);
    expect(byKey(ls, 'tanAcute').value).toBeCloseTo(16.76, 1);
    expect(byKey(ls, 'tanChronic').source).toMatch(/EPA/);
  });

  it('uses the CCME free-ammonia guideline 0.019 mg NH3/L by default', () => {
    expect(byKey(tankLimits({ ph: 7, temperatureC: 25 }), 'freeNh3').value).toBe(0.019);
  });

  it('bases nitrite on chloride where the tank gives it (16 Cl⁻ : 1 NO2⁻ molar, Tomasso et al. 1979)', () => {
    const n = byKey(tankLimits({ ph: 7, temperatureC: 25, chlorideMgL: 25 }), 'nitrite');
    expect(n.value).toBeCloseTo((25 / 35.453 / 16) * 14.007, 6);
    expect(n.basis).toMatch(/chloride/);
    expect(byKey(tankLimits({ ph: 7, temperatureC: 25 }), 'nitrite').value).toBe(0.1); // Boyd: < 0.1 mg/L
  });

  it('scales defaults for sensitive species and shows the change', () => {
    const n = byKey(tankLimits({ ph: 7, temperatureC: 25 }, { sensitivityFactor: 0.5 }), 'freeNh3');
    expect(n.value).toBeCloseTo(0.0095, 10);
    expect(n.adjusted).toBe(true);
    expect(n.basis).toMatch(/50 %/);
  });

  it('takes a keeper\'s value for one limit and keeps the default beside it', () => {
    const n = byKey(tankLimits({ ph: 7, temperatureC: 25 }, { overrides: { nitrite: 0.05 } }), 'nitrite');
    expect(n.value).toBe(0.05);
    expect(n.defaultValue).toBe(0.1);
    expect(n.fixedByKeeper).toBe(true);
  });

  it('refuses a factor that would loosen the limits', () => {
    expect(() => tankLimits({ ph: 7, temperatureC: 25 }, { sensitivityFactor: 1.5 })).toThrow(RangeError);
  });
});

describe('one source of truth for per-tank limits', () => {
  it('the advice layer’s tankLimits is the engine’s (simulation/limits.ts)', async () => {
    const engine = await import('../../../simulation/limits');
    expect(tankLimits).toBe(engine.tankLimits);
    expect(engine.tankLimits({ ph: 7, temperatureC: 25 }, { sensitivityFactor: 0.5 })[0].value).toBeCloseTo(0.0095, 10); // CCME 0.019 × 0.5
  });
});
