import { describe, expect, it } from 'vitest';
import { forecast } from '@/simulation/forecast';
import { ScenarioError } from '@/simulation/scenario';
import { ABSURD_STOCKING_G_PER_L, HEAVY_STOCKING_G_PER_L, fishMassOnDayG, groupsMassG, stockingLevel, stockingWarning } from '@/simulation/stocking';
import { matureWithPlaties } from './scenarios';

/**
 * The crowding rule (simulation/stocking.ts): fish mass per litre against common practice
 * (well-stocked home tanks hold roughly 0.2–3 g of fish a litre, from memory), a warning above
 * 5 g/L, a refusal only above 250 g/L, where the fish would weigh over a quarter of the water.
 */

describe('stocking level', () => {
  it('uses the engine\'s fish masses: a neon tetra about a quarter gram, from its catalogue length (W = a·L^b, Froese 2006)', () => {
    // 3.5 cm, slender a = 0.006 (from memory), b = 3.03: 0.006 · 3.5^3.03 ≈ 0.27 g.
    expect(groupsMassG([{ species: 'neon-tetra', count: 1 }])).toBeCloseTo(0.006 * 3.5 ** 3.03, 6);
  });

  it('says nothing for a common community tank: 40 neon tetras and 6 bronze corydoras in 60 L', () => {
    const g = groupsMassG([{ species: 'neon-tetra', count: 40 }, { species: 'bronze-corydoras', count: 6 }]);
    expect(stockingLevel(g, 60).level).toBe('usual');
    expect(stockingWarning(g, 60)).toBeNull();
  });

  it('warns, in plain words, for 10,000 neon tetras in 120 L (about 22 g a litre), without refusing', () => {
    const g = groupsMassG([{ species: 'neon-tetra', count: 10000 }]);
    expect(g / 120).toBeGreaterThan(4 * HEAVY_STOCKING_G_PER_L);
    expect(stockingLevel(g, 120).level).toBe('heavy');
    const words = stockingWarning(g, 120, '120 L')!;
    expect(words).toMatch(/^These fish would weigh about 2\.7 kg in 120 L, over 4 times the most that home tanks usually carry \(common practice\)\./);
    expect(words).not.toMatch(/neon-tetra|g\/L|capacity/);
  });

  it('puts the warning line at 5 g of fish a litre and the refusal at 250', () => {
    expect(stockingLevel(5 * 100, 100).level).toBe('usual');
    expect(stockingLevel(5.01 * 100, 100).level).toBe('heavy');
    expect(stockingLevel(ABSURD_STOCKING_G_PER_L * 100, 100).level).toBe('heavy');
    expect(stockingLevel(ABSURD_STOCKING_G_PER_L * 100 + 1, 100).level).toBe('absurd');
  });

  it('words the tank in the keeper\'s units when given', () => {
    expect(stockingWarning(3000, 120, '31.7 US gal')).toContain('in 31.7 US gal');
  });

  it('follows a plan to a day: additions in, removals out, later events not yet', () => {
    const start = [{ species: 'platy', count: 10 }];
    const one = groupsMassG([{ species: 'platy', count: 1 }]);
    const events = [
      { type: 'add-fish' as const, day: 2, fish: [{ species: 'platy', count: 5 }] },
      { type: 'remove-fish' as const, day: 4, fish: [{ species: 'platy', count: 3 }] },
      { type: 'add-fish' as const, day: 9, fish: [{ species: 'platy', count: 50 }] },
    ];
    expect(fishMassOnDayG(start, events, 0)).toBeCloseTo(10 * one, 9);
    expect(fishMassOnDayG(start, events, 3)).toBeCloseTo(15 * one, 9);
    expect(fishMassOnDayG(start, events, 5)).toBeCloseTo(12 * one, 9);
  });
});

describe('the engine refuses fish that could not fit in the water', () => {
  it('names the event whose fish would weigh more than a quarter of the water', () => {
    // 100,000 platies (about 6 g each) in 100 L: about 6 kg a litre.
    try {
      forecast(matureWithPlaties(2, [{ type: 'add-fish', day: 1, fish: [{ species: 'platy', count: 100000 }] }]), { horizonDays: 5 });
      throw new Error('expected a refusal');
    } catch (e) {
      expect(e).toBeInstanceOf(ScenarioError);
      expect((e as ScenarioError).fields['events.0.fish']).toMatch(/more than a quarter of the water's own weight: no tank can hold that/);
    }
  });

  it('forecasts a crowded but possible tank', () => {
    expect(() => forecast(matureWithPlaties(2, [{ type: 'add-fish', day: 1, fish: [{ species: 'neon-tetra', count: 10000 }] }]), { horizonDays: 5 })).not.toThrow();
  });
});
