import { describe, expect, it } from 'vitest';
import { addDays, planCheckDays } from '@/shared/plan-check-days';
import { applySchedule, sortEvents } from '@/lib/draft-store';
import { blankFields, describeEvent, describeEventOnDay, eventToFields, fieldsToEvent, EVENT_TYPES } from '@/components/plans/event-fields';
import { EVENT_KINDS } from '@/components/plans/event-kinds';
import { eventSchema, type ScenarioEvent } from '@/simulation/scenario';

const add = (day: number, count: number): ScenarioEvent => ({ type: 'add-fish', day, fish: { species: 'neon-tetra', count, lengthCm: 3 } });
const wc = (day: number): ScenarioEvent => ({ type: 'water-change', day, percent: 25 });

describe('planCheckDays', () => {
  it('asks for a test before the plan and daily for three days after adding fish (common practice)', () => {
    const days = planCheckDays([add(0, 6)], '2026-03-01').map((d) => d.day);
    expect(days.slice(0, 4)).toEqual([0, 1, 2, 3]);
  });

  it('merges reasons that fall on the same day', () => {
    const d7 = planCheckDays([add(0, 6), add(5, 6)], '2026-03-01').find((d) => d.day === 7)!;
    expect(d7.reasons).toHaveLength(2);
  });

  it('answers no check days for a plan without events', () => {
    expect(planCheckDays([], '2026-03-01')).toEqual([]);
  });

  it('dates each day from the start date, and leaves the date empty for an unreadable start', () => {
    expect(addDays('2026-02-27', 3)).toBe('2026-03-02');
    expect(addDays('soon', 3)).toBe('');
  });
});

describe('applySchedule', () => {
  it("replaces the plan's add-fish events with the schedule's and keeps the rest, by day", () => {
    const next = applySchedule([add(0, 12), wc(4)], [add(0, 4), add(9, 8)]);
    expect(next).toEqual([add(0, 4), wc(4), add(9, 8)]);
  });

  it('keeps the planned day: 20 neons planned for day 7 go in on day 7 and later, never earlier (issue 14)', () => {
    expect(applySchedule([wc(4), add(7, 20)], [add(7, 10), add(12, 10)])).toEqual([wc(4), add(7, 10), add(12, 10)]);
    expect(applySchedule([wc(4), add(7, 20)], [add(0, 20)])).toBeNull();
    expect(applySchedule([wc(4), add(7, 20)], [add(7, 10), add(6, 10)])).toBeNull();
  });

  it("replaces only the schedule's own fish: another species' addition stays", () => {
    const platy: ScenarioEvent = { type: 'add-fish', day: 3, fish: { species: 'platy', count: 5 } };
    expect(applySchedule([add(0, 12), platy], [add(0, 6), add(5, 6)])).toEqual([add(0, 6), platy, add(5, 6)]);
  });

  it('refuses an empty schedule (nothing to apply)', () => {
    expect(applySchedule([add(0, 12)], [])).toBeNull();
  });

  it('sorts events by day, keeping same-day order', () => {
    expect(sortEvents([wc(3), add(1, 2), wc(1)])).toEqual([add(1, 2), wc(1), wc(3)]);
  });
});

describe('event fields', () => {
  it('round-trips every kind of event through its form fields', () => {
    const samples: ScenarioEvent[] = [
      add(2, 6),
      { type: 'remove-fish', day: 3, species: 'neon-tetra', count: 2 },
      { type: 'move-fish', day: 1, direction: 'out', otherTank: 'Shrimp cube', fish: { species: 'neon-tetra', count: 3 } },
      { type: 'feeding', day: 0, feeding: { mode: 'grams', gramsPerDay: 1.5 } },
      wc(4),
      { type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 1 }, repeatEveryDays: 2, repeatCount: 5 },
      { type: 'filter-clean', day: 6, zoneId: 'filter', action: 'rinse', shareLost: 0.3 },
      { type: 'medication', day: 2, name: 'Salt', durationDays: 5, oxidationMultiplier: 0.5 },
      { type: 'temperature', day: 1, temperatureC: 27 },
      { type: 'aeration-loss', day: 1, durationDays: 1, oxygenShare: 0.5 },
    ];
    expect(samples.map((e) => e.type).sort()).toEqual(EVENT_TYPES.map((t) => t.type).sort());
    for (const e of samples) expect(fieldsToEvent(e.type, eventToFields(e))).toEqual({ event: e });
  });

  it('puts a schema error under the field the keeper typed in', () => {
    const result = fieldsToEvent('add-fish', { ...blankFields('add-fish'), species: 'neon-tetra', count: '0' });
    expect(result).toEqual({ errors: { count: expect.any(String) } });
  });

  it('refuses text that is not a number in a number field', () => {
    const result = fieldsToEvent('water-change', { day: '2', percent: 'a lot' });
    expect('errors' in result && result.errors.percent).toBeTruthy();
  });

  it('accepts a decimal comma', () => {
    expect(fieldsToEvent('water-change', { day: '2', percent: '12,5' })).toEqual({ event: { type: 'water-change', day: 2, percent: 12.5 } });
  });

  it('names catalogue fish by their common name', () => {
    expect(describeEvent(add(0, 4))).toBe('Add 4 Neon tetra');
  });
});

describe('event kinds', () => {
  it("has one record entry for every event type the engine's schema accepts", () => {
    const engineTypes = eventSchema.options.map((o) => o.shape.type.value).sort();
    expect(Object.keys(EVENT_KINDS).sort()).toEqual(engineTypes);
  });

  it("puts a medicine name error under the medicine field, not a fish field", () => {
    const result = fieldsToEvent('medication', { ...blankFields('medication'), name: 'x'.repeat(81) });
    expect(result).toEqual({ errors: { name: expect.any(String) } });
  });

  it('says the day in read-only lists', () => {
    expect(describeEventOnDay(wc(3))).toBe('Day 3: Change 25 % of the water');
  });

  it('describes every kind in a sentence that starts with a capital letter', () => {
    const samples: ScenarioEvent[] = [
      add(2, 6),
      { type: 'ammonia-dose', day: 0, amount: { unit: 'ammonium-chloride-g', grams: 0.5 }, repeatEveryDays: 2, repeatCount: 5 },
      { type: 'filter-clean', day: 6, zoneId: 'filter', action: 'replace', shareLost: 0.9 },
      { type: 'aeration-loss', day: 1, durationDays: 1, oxygenShare: 0.5 },
    ];
    expect(samples.map(describeEvent)).toEqual([
      'Add 6 Neon tetra',
      'Dose ammonia 0.5 g ammonium chloride, every 2 days, 5 times',
      'Replace filter media (about 90 % of its nitrifiers lost)',
      'Aeration drops to 50 % for 1 day',
    ]);
  });
});
