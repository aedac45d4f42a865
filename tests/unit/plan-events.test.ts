import { describe, expect, it } from 'vitest';
import { addDays, planCheckDays } from '@/shared/plan-check-days';
import { applySchedule, sortEvents } from '@/lib/draft-store';
import { blankFields, describeEvent, describeEventOnDay, eventToFields, fieldsToEvent, EVENT_TYPES, FIELDS } from '@/components/plans/event-fields';
import { EVENT_KINDS } from '@/components/plans/event-kinds';
import { eventShapesSchema, type ScenarioEvent } from '@/simulation/scenario';

const add = (day: number, count: number): ScenarioEvent => ({ type: 'add-fish', day, fish: [{ species: 'neon-tetra', count, lengthCm: 3 }] });
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
    const platy: ScenarioEvent = { type: 'add-fish', day: 3, fish: [{ species: 'platy', count: 5 }] };
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
      { type: 'remove-fish', day: 3, fish: [{ species: 'neon-tetra', count: 2 }] },
      { type: 'move-fish', day: 1, direction: 'out', otherTank: 'Shrimp cube', fish: [{ species: 'neon-tetra', count: 3 }] },
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
    const result = fieldsToEvent('add-fish', { ...blankFields('add-fish'), 'fish.0.species': 'neon-tetra', 'fish.0.count': '0' });
    expect(result).toEqual({ errors: { 'fish.0.count': 'Count must be at least 1.' } });
  });

  it('says in words that a count is missing, never the schema wording', () => {
    const result = fieldsToEvent('add-fish', { ...blankFields('add-fish'), 'fish.0.species': 'neon-tetra' });
    expect(result).toEqual({ errors: { 'fish.0.count': 'Say how many.' } });
  });

  it("asks for the length or mass of the keeper's own fish beside its length field", () => {
    const result = fieldsToEvent('add-fish', { day: '0', 'fish.0.name': 'Big red', 'fish.0.count': '2' });
    expect(result).toEqual({ errors: { 'fish.0.lengthCm': 'A fish that is not in the species list needs its length (or its weight).' } });
    expect(fieldsToEvent('add-fish', { day: '0', 'fish.0.name': 'Big red', 'fish.0.count': '2', 'fish.0.massG': '40' })).toEqual({
      event: { type: 'add-fish', day: 0, fish: [{ name: 'Big red', count: 2, massG: 40 }] },
    });
  });

  it('carries two species in one add event, each error on its own row', () => {
    const two = { day: '3', 'fish.0.species': 'neon-tetra', 'fish.0.count': '10', 'fish.1.species': 'bronze-corydoras', 'fish.1.count': '6' };
    expect(fieldsToEvent('add-fish', two)).toEqual({
      event: { type: 'add-fish', day: 3, fish: [{ species: 'neon-tetra', count: 10 }, { species: 'bronze-corydoras', count: 6 }] },
    });
    expect(fieldsToEvent('add-fish', { ...two, 'fish.1.count': '1.5' })).toEqual({ errors: { 'fish.1.count': 'Count must be a whole number.' } });
    expect(describeEvent((fieldsToEvent('add-fish', two) as { event: ScenarioEvent }).event)).toBe('Add 10 Neon tetra and 6 Bronze corydoras');
  });

  it('rehomes several species in one event', () => {
    const f = { day: '5', 'fish.0.species': 'neon-tetra', 'fish.0.count': '4', 'fish.1.name': 'Big red', 'fish.1.count': '1' };
    expect(fieldsToEvent('remove-fish', f)).toEqual({
      event: { type: 'remove-fish', day: 5, fish: [{ species: 'neon-tetra', count: 4 }, { name: 'Big red', count: 1 }] },
    });
  });

  it('asks which fish when a row has a count but no species', () => {
    expect(fieldsToEvent('remove-fish', { day: '5', 'fish.0.count': '4' })).toEqual({ errors: { 'fish.0.species': 'Say which fish: species or name.' } });
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

describe('the dose form: once, N times a day or continuous', () => {
  const split: ScenarioEvent = { type: 'ammonia-dose', day: 1, amount: { unit: 'mgN-per-L', value: 0.4 }, timesPerDay: 4, repeatEveryDays: 1, repeatCount: 20 };
  const steady: ScenarioEvent = { type: 'ammonia-dose', day: 1, amount: { unit: 'mgN-per-L', value: 0.4 }, delivery: 'continuous', repeatEveryDays: 1, repeatCount: 20 };

  it('round-trips a split and a continuous dose through the form', () => {
    expect(eventToFields(split)).toMatchObject({ delivery: 'split', timesPerDay: '4' });
    expect(eventToFields(steady)).toMatchObject({ delivery: 'continuous' });
    for (const e of [split, steady]) expect(fieldsToEvent(e.type, eventToFields(e))).toEqual({ event: e });
  });

  it('offers the three ways and shows "Times a day" only for N times a day', () => {
    const specs = FIELDS['ammonia-dose'];
    const delivery = specs.find((f) => f.key === 'delivery')!;
    expect(delivery.choices?.map((c) => c.label)).toEqual(['Once', 'N times a day', 'Continuous (dosing pump / drip)']);
    const times = specs.find((f) => f.key === 'timesPerDay')!;
    expect(times.shownWhen?.({ delivery: 'split' })).toBe(true);
    expect(times.shownWhen?.({ delivery: 'once' })).toBe(false);
    expect(times.shownWhen?.({ delivery: 'continuous' })).toBe(false);
  });

  it('a new dose is given once; choosing "once" drops any split the form still holds', () => {
    const f = blankFields('ammonia-dose', 2);
    expect(f.delivery).toBe('once');
    expect(fieldsToEvent('ammonia-dose', { ...f, timesPerDay: '4' })).toEqual({ event: { type: 'ammonia-dose', day: 2, amount: { unit: 'mgN-per-L', value: 1 } } });
  });

  it('puts the schema refusals under the field: no number of times, too many, or a split repeated within the day', () => {
    const base = { ...blankFields('ammonia-dose', 0), delivery: 'split' };
    const errorsOf = (f: Record<string, string>) => {
      const r = fieldsToEvent('ammonia-dose', f);
      return 'errors' in r ? r.errors : {};
    };
    expect(errorsOf({ ...base, timesPerDay: '' }).timesPerDay).toMatch(/whole number from 1 to 8/);
    expect(errorsOf({ ...base, timesPerDay: '12' }).timesPerDay).toMatch(/at most 8/);
    expect(errorsOf({ ...base, timesPerDay: '4', repeatEveryDays: '0.5' }).repeatEveryDays).toMatch(/at least 1/);
  });

  it('says how the dose goes in, in the sentence the timeline and the printed plan use', () => {
    expect(describeEvent(split)).toBe('Dose ammonia 0.4 mg N/L in 4 equal doses 6 h apart, every day, 20 times');
    expect(describeEvent(steady)).toBe('Dose ammonia 0.4 mg N/L a day for 20 days, continuously (dosing pump or drip)');
    expect(describeEvent({ ...steady, repeatEveryDays: undefined, repeatCount: undefined })).toBe('Dose ammonia 0.4 mg N/L over one day, continuously (dosing pump or drip)');
  });
});

describe('event kinds', () => {
  it("has one record entry for every event type the engine's schema accepts", () => {
    const engineTypes = eventShapesSchema.options.map((o) => o.shape.type.value).sort();
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
