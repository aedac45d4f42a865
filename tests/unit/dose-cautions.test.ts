import { describe, expect, it } from 'vitest';
import { doseFormCautions } from '@/components/plans/dose-cautions';
import { dosesWithFish, fishOnDay } from '@/shared/fish-on-day';
import { AMMONIA_HANDLING_CAUTIONS, DOSING_WITH_FISH_CAUTIONS } from '@/simulation/advice/cautions';
import type { ScenarioEvent } from '@/simulation/scenario';

const dose = (day: number): ScenarioEvent => ({ type: 'ammonia-dose', day, amount: { unit: 'mgN-per-L', value: 0.5 } });

describe('the dose form cautions (the engine’s words, reused)', () => {
  it('always shows the handling cautions; the fish-present one only with fish in the tank', () => {
    expect(doseFormCautions(0)).toEqual({ handling: AMMONIA_HANDLING_CAUTIONS, withFish: [] });
    expect(doseFormCautions(3).withFish).toEqual(DOSING_WITH_FISH_CAUTIONS);
    expect(AMMONIA_HANDLING_CAUTIONS.join(' ')).toMatch(/gloves and eye protection/);
  });

  it('counts the fish a plan has on a day: start, additions and moves in, less rehomings and moves out', () => {
    const events: ScenarioEvent[] = [
      { type: 'remove-fish', day: 1, fish: [{ species: 'platy', count: 10 }] },
      { type: 'move-fish', day: 2, direction: 'in', fish: [{ species: 'platy', count: 3 }] },
      { type: 'add-fish', day: 30, fish: [{ species: 'platy', count: 10 }] },
      dose(5),
    ];
    expect(fishOnDay(10, events, 0)).toBe(10);
    expect(fishOnDay(10, events, 1)).toBe(0);
    expect(fishOnDay(10, events, 5)).toBe(3);
    expect(fishOnDay(10, events, 30)).toBe(13);
    expect(dosesWithFish(10, events)).toBe(true);
    expect(dosesWithFish(10, [events[0], dose(5)])).toBe(false);
  });
});
