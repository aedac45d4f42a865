import { describe, expect, it } from 'vitest';
import { addGroup, blankGroup, fieldsToGroups, groupCount, groupsToFields, groupsWords, removeGroup, removeGroupErrors } from '@/components/plans/fish-groups';
import { planErrors } from '@/components/plans/plan-errors';
import { eventStocking } from '@/components/plans/event-stocking';
import { livestockStocking } from '@/components/tanks/livestock-stocking';
import type { LivestockItem } from '@/shared/schemas/tank';
import type { ScenarioEvent } from '@/simulation/scenario';

/** The plan event form's fish rows (components/plans/fish-groups.ts) and what it shows about them. */
describe('fish rows of an event form', () => {
  it('starts with one empty row, adds rows at the end and takes any row out, moving later ones up', () => {
    let f: Record<string, string> = { day: '0', ...blankGroup(0) };
    expect(groupCount(f)).toBe(1);
    f = addGroup(addGroup(f));
    expect(groupCount(f)).toBe(3);
    f = { ...f, 'fish.0.species': 'neon-tetra', 'fish.1.species': 'platy', 'fish.2.name': 'Big red', 'fish.2.count': '1' };
    const out = removeGroup(f, 1);
    expect(groupCount(out)).toBe(2);
    expect(out).toMatchObject({ day: '0', 'fish.0.species': 'neon-tetra', 'fish.1.name': 'Big red', 'fish.1.count': '1' });
    expect(removeGroup({ day: '2', ...blankGroup(0), 'fish.0.species': 'platy' }, 0)).toEqual({ day: '2', ...blankGroup(0) });
  });

  it('keeps error messages beside their rows when a row is taken out', () => {
    expect(removeGroupErrors({ 'fish.0.count': 'a', 'fish.1.count': 'b', 'fish.2.lengthCm': 'c', day: 'd' }, 1)).toEqual({ 'fish.0.count': 'a', 'fish.1.lengthCm': 'c', day: 'd' });
  });

  it('turns rows into groups, leaving out an untouched extra row, and back', () => {
    const f = { 'fish.0.species': 'neon-tetra', 'fish.0.count': '10', 'fish.1.name': ' Big red ', 'fish.1.count': '1', 'fish.1.massG': '12,5', ...blankGroup(2) };
    expect(fieldsToGroups(f, 'sized')).toEqual([
      { species: 'neon-tetra', count: 10, lengthCm: undefined, massG: undefined },
      { name: 'Big red', count: 1, lengthCm: undefined, massG: 12.5 },
    ]);
    expect(fieldsToGroups(f, 'count-only')).toEqual([{ species: 'neon-tetra', count: 10 }, { name: 'Big red', count: 1 }]);
    expect(groupsToFields([{ species: 'neon-tetra', count: 10, lengthCm: 3 }])).toEqual({ 'fish.0.species': 'neon-tetra', 'fish.0.name': '', 'fish.0.count': '10', 'fish.0.lengthCm': '3' });
  });

  it('names the fish in plain words, never by catalogue id', () => {
    expect(groupsWords([{ species: 'neon-tetra', count: 10 }, { species: 'bronze-corydoras', count: 6 }, { name: 'Big red', count: 1 }])).toBe(
      '10 Neon tetra, 6 Bronze corydoras and 1 Big red',
    );
    expect(groupsWords([{ species: 'no-such-fish', count: 2 }])).toBe('2 fish not in the catalogue');
  });
});

describe('a refused plan in words', () => {
  const events: ScenarioEvent[] = [
    { type: 'water-change', day: 1, percent: 20 },
    { type: 'add-fish', day: 3, fish: [{ species: 'neon-tetra', count: 10 }, { name: 'Big red', count: 1, lengthCm: 9 }] },
  ];

  it('says which event a message is about and puts it on that event\'s field, never showing the path', () => {
    const r = planErrors({ 'events.1.fish.1.lengthCm': 'Length must be above 0 cm.', name: 'Give the plan a name.', 'fish.0.lengthCm': 'Give the length.' }, events, ['name']);
    expect(r.byEvent).toEqual({ 1: { 'fish.1.lengthCm': 'Length must be above 0 cm.' } });
    expect(r.sentences).toEqual(['Day 3: Add 10 Neon tetra and 1 Big red: Length must be above 0 cm.', "The tank's fish: Give the length."]);
    for (const s of r.sentences) expect(s).not.toMatch(/events\.|fish\.\d|lengthCm/);
  });

  it('maps a kind\'s own schema paths to its form fields', () => {
    const dose: ScenarioEvent[] = [{ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 1 } }];
    expect(planErrors({ 'events.0.amount.value': 'Too much.' }, dose).byEvent).toEqual({ 0: { mgNPerL: 'Too much.' } });
  });
});

describe('crowding warning where fish are added', () => {
  const livestock = [{ id: 'a', speciesId: 'neon-tetra', customName: null, count: 20, lengthCm: null } as unknown as LivestockItem];

  it('warns on the livestock form for 10,000 neon tetras in 120 L and not for 10 more', () => {
    expect(livestockStocking(120, '120 L', livestock, { species: 'neon-tetra', count: 10000 })).toMatch(/^These fish would weigh/);
    expect(livestockStocking(120, '120 L', livestock, { species: 'neon-tetra', count: 10 })).toBeNull();
  });

  it("warns on an event from the tank's fish on that day plus the rows typed", () => {
    const ctx = { volumeL: 120, volumeText: '120 L', startFish: [{ species: 'neon-tetra', count: 20 }], events: [] };
    expect(eventStocking(ctx, { day: '2', 'fish.0.species': 'neon-tetra', 'fish.0.count': '10000' }, null)).toMatch(/in 120 L/);
    expect(eventStocking(ctx, { day: '2', 'fish.0.species': 'neon-tetra', 'fish.0.count': '10' }, null)).toBeNull();
    // An unfinished row (no count yet) says nothing.
    expect(eventStocking(ctx, { day: '2', 'fish.0.species': 'neon-tetra', 'fish.0.count': '' }, null)).toBeNull();
  });

  it('leaves the event being edited out of the plan, so its own fish are not counted twice', () => {
    const saved: ScenarioEvent = { type: 'add-fish', day: 1, fish: [{ species: 'neon-tetra', count: 6000 }] };
    const ctx = { volumeL: 120, volumeText: '120 L', startFish: [], events: [saved] };
    const f = { day: '1', 'fish.0.species': 'neon-tetra', 'fish.0.count': '1000' };
    expect(eventStocking(ctx, f, saved)).toBeNull();
    expect(eventStocking(ctx, f, null)).toMatch(/^These fish would weigh/);
  });
});
