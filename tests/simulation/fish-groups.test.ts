import { describe, expect, it } from 'vitest';
import { forecast } from '@/simulation/forecast';
import { eventSchema, parseScenario, ScenarioError, type ScenarioInput } from '@/simulation/scenario';
import { fieldErrors } from '@/simulation/scenario-error';
import { matureWithPlaties } from './scenarios';

/**
 * Fish events with several groups (issue 15): the list shape, the older one-group shapes still
 * read, and the same forecast whichever way the same fish are written.
 */

const errorsOf = (input: unknown) => {
  const r = eventSchema.safeParse(input);
  return r.success ? {} : fieldErrors(r.error.issues);
};

describe('fish groups in one event', () => {
  it('reads a list of groups, and a single group as a list of one', () => {
    const two = { type: 'add-fish', day: 1, fish: [{ species: 'neon-tetra', count: 10 }, { species: 'bronze-corydoras', count: 6 }] };
    expect(eventSchema.parse(two)).toEqual(two);
    expect(eventSchema.parse({ type: 'add-fish', day: 1, fish: { species: 'platy', count: 3 } })).toEqual({ type: 'add-fish', day: 1, fish: [{ species: 'platy', count: 3 }] });
    expect(eventSchema.parse({ type: 'move-fish', day: 1, direction: 'out', fish: { species: 'platy', count: 3 } })).toMatchObject({ fish: [{ species: 'platy', count: 3 }] });
  });

  it("reads the older removal (species and count on the event) as one group, and the list form", () => {
    expect(eventSchema.parse({ type: 'remove-fish', day: 4, species: 'platy', count: 2 })).toEqual({ type: 'remove-fish', day: 4, fish: [{ species: 'platy', count: 2 }] });
    expect(eventSchema.parse({ type: 'remove-fish', day: 4, name: 'Big red', count: 1 })).toEqual({ type: 'remove-fish', day: 4, fish: [{ name: 'Big red', count: 1 }] });
    const list = { type: 'remove-fish', day: 4, fish: [{ species: 'platy', count: 2 }, { name: 'Big red', count: 1 }] };
    expect(eventSchema.parse(list)).toEqual(list);
  });

  it('names the field inside the group, whichever shape the group came in', () => {
    expect(errorsOf({ type: 'add-fish', day: 0, fish: { species: 'platy', count: 0 } })).toEqual({ 'fish.count': 'Count must be at least 1.' });
    expect(errorsOf({ type: 'add-fish', day: 0, fish: [{ species: 'platy', count: 2 }, { name: 'Big red', count: 1 }] })).toEqual({
      'fish.1.lengthCm': 'A fish that is not in the species list needs its length (or its weight).',
    });
    expect(errorsOf({ type: 'add-fish', day: 0, fish: [] })).toEqual({ fish: 'Name at least one kind of fish.' });
    expect(errorsOf({ type: 'add-fish', day: 0 })).toEqual({ fish: 'List the fish: each kind with its species or name and its count.' });
    expect(errorsOf({ type: 'remove-fish', day: 0, fish: [{ count: 2 }] })).toEqual({ 'fish.0.species': 'Say which fish: species or name.' });
    expect(errorsOf({ type: 'remove-fish', day: 0, species: 'platy' })).toEqual({ count: 'Say how many.' });
    expect(errorsOf({ type: 'remove-fish', day: 0, species: 'platy', count: 1, fish: [{ species: 'platy', count: 1 }] })).toHaveProperty('fish');
  });

  it('refuses more than 20 kinds in one event, naming the list', () => {
    const many = Array.from({ length: 21 }, (_, i) => ({ name: `Fish ${i}`, count: 1, lengthCm: 3 }));
    expect(errorsOf({ type: 'add-fish', day: 0, fish: many })).toEqual({ fish: 'At most 20 kinds of fish in one event.' });
  });

  it('forecasts two groups in one event exactly as two events on the same day, and an old single group as a list of one', () => {
    const together = forecast(matureWithPlaties(6, [{ type: 'add-fish', day: 2, fish: [{ species: 'platy', count: 6 }, { species: 'neon-tetra', count: 10 }] }]), { horizonDays: 20 });
    const apart = forecast(
      matureWithPlaties(6, [
        { type: 'add-fish', day: 2, fish: { species: 'platy', count: 6 } },
        { type: 'add-fish', day: 2, fish: { species: 'neon-tetra', count: 10 } },
      ]),
      { horizonDays: 20 },
    );
    expect(together.series.tanMgN).toEqual(apart.series.tanMgN);
    expect(together.series.no2MgN).toEqual(apart.series.no2MgN);
    // The new fish raise the load: the forecast is not the same as without them.
    const without = forecast(matureWithPlaties(6), { horizonDays: 20 });
    expect(Math.max(...together.series.tanMgN)).toBeGreaterThan(Math.max(...without.series.tanMgN));
  });

  it('takes each removed group out of the fish present, naming the group that asks for more than there is', () => {
    const s: ScenarioInput = matureWithPlaties(5, [{ type: 'remove-fish', day: 1, fish: [{ species: 'platy', count: 2 }, { species: 'platy', count: 4 }] }]);
    try {
      forecast(s, { horizonDays: 10 });
      throw new Error('expected a refusal');
    } catch (e) {
      expect(e).toBeInstanceOf(ScenarioError);
      expect((e as ScenarioError).fields).toEqual({ 'events.0.fish.1.count': 'Only 3 Platy in the tank at that time; cannot take out 4.' });
    }
  });

  it('keeps the list shape through a second parse (what the server stores is valid input)', () => {
    const once = parseScenario(matureWithPlaties(3, [{ type: 'remove-fish', day: 1, species: 'platy', count: 1 }]));
    expect(parseScenario(once).events).toEqual(once.events);
  });
});
