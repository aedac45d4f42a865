import { describe, expect, it } from 'vitest';
import { forecast } from '@/simulation/forecast';
import { ScenarioError, type ScenarioInput } from '@/simulation/scenario';
import { matureWithPlaties, startUp, tank } from './scenarios';

function fieldsOf(s: unknown, options = {}): Record<string, string> {
  try {
    forecast(s as ScenarioInput, options);
  } catch (e) {
    if (e instanceof ScenarioError) return e.fields;
    throw e;
  }
  throw new Error('expected a ScenarioError');
}

describe('scenario validation names the field', () => {
  it('refuses a negative volume', () => {
    expect(Object.keys(fieldsOf(startUp({ volumeL: -5 })))).toContain('tank.volumeL');
  });

  it('refuses pH outside 4–10', () => {
    expect(fieldsOf(startUp({ ph: 11 }))['tank.ph']).toMatch(/between 4 and 10/);
    expect(fieldsOf(startUp({ ph: 3.9 }))['tank.ph']).toBeDefined();
  });

  it('refuses NaN', () => {
    expect(Object.keys(fieldsOf(startUp({ temperatureC: NaN })))).toContain('tank.temperatureC');
  });

  it('refuses events after the horizon', () => {
    const s = matureWithPlaties(5, [{ type: 'water-change', day: 10, percent: 20 }, { type: 'water-change', day: 90, percent: 20 }]);
    expect(fieldsOf(s, { horizonDays: 60 })['events.1.day']).toMatch(/after the forecast horizon/);
  });

  it('refuses unknown species and removals of fish that are not there', () => {
    expect(Object.keys(fieldsOf({ ...matureWithPlaties(5), fish: [{ species: 'unicorn-fish', count: 2 }] }))).toContain('fish.0.species');
    const s = matureWithPlaties(5, [{ type: 'remove-fish', day: 1, species: 'platy', count: 3 }, { type: 'remove-fish', day: 2, species: 'platy', count: 3 }]);
    // The older single-group removal is still read; the message names the group it became.
    expect(fieldsOf(s)['events.1.fish.0.count']).toMatch(/Only 2/);
  });

  it('refuses a filter clean of a zone the tank does not have', () => {
    const s = matureWithPlaties(5, [{ type: 'filter-clean', day: 1, zoneId: 'sump', action: 'rinse', shareLost: 0.5 }]);
    expect(fieldsOf(s)['events.0.zoneId']).toMatch(/no "sump" to clean/);
  });

  it('refuses a zone with neither area nor media, and duplicate zone ids', () => {
    expect(Object.keys(fieldsOf(startUp({ zones: [{ id: 'a', kind: 'filter' }] })))).toContain('tank.zones.0.areaM2');
    const dup = startUp({ zones: [{ id: 'a', kind: 'filter', areaM2: 1 }, { id: 'a', kind: 'surfaces', areaM2: 1 }] });
    expect(Object.keys(fieldsOf(dup))).toContain('tank.zones.1.id');
  });

  it('refuses a mature start whose load exceeds the zones', () => {
    const s: ScenarioInput = { tank: tank({ zones: [{ id: 'f', kind: 'filter', areaM2: 0.01 }] }), start: { kind: 'mature', loadMgNPerDay: 500 } };
    expect(fieldsOf(s)['start.loadMgNPerDay']).toMatch(/more than the filter bacteria this tank has room for can ever clear/);
  });

  it('refuses bad options and parameters', () => {
    expect(Object.keys(fieldsOf(startUp(), { stepDays: 0 }))).toContain('options.stepDays');
    expect(fieldsOf(startUp(), { parameters: { muMaxAo: -1 } })['options.parameters']).toMatch(/muMaxAo/);
    expect(fieldsOf(startUp(), { parameters: { notAParameter: 1 } })['options.parameters']).toMatch(/unknown/);
  });
});
