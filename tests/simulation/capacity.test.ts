import { describe, expect, it } from 'vitest';
import { parseScenario, ScenarioError } from '@/simulation/scenario';
import { steadyStateCapacity } from '@/simulation/capacity';
import { forecastParsed } from '@/simulation/forecast';
import { expectClose } from './helpers';
import { matureWithPlaties } from './scenarios';

describe('steadyStateCapacity', () => {
  it('is the day-0 capacity of a mature-start forecast, whatever the scenario’s own start and events', () => {
    const mature = parseScenario(matureWithPlaties(20));
    const f = forecastParsed(mature, { horizonDays: 1 });
    const other = parseScenario({ ...matureWithPlaties(20, [{ type: 'add-fish', day: 0, fish: { species: 'platy', count: 50 } }]), start: { kind: 'new' } });
    const c = steadyStateCapacity(other);
    expectClose(c.aoMgNPerDay, f.summary.final.aoMgNPerDay, 1e-3); // final = day 1, still settled
    expectClose(c.zones[0].aoMgNPerDay, f.series.zones[0].ao[0], 1e-12);
    expectClose(c.tanMgN, f.series.tanMgN[0], 1e-12);
  });

  it('grows with the stocking and with an explicit load, and is ~the load in a settled tank (oxidation = supply)', () => {
    const small = steadyStateCapacity(parseScenario(matureWithPlaties(10)));
    const large = steadyStateCapacity(parseScenario(matureWithPlaties(40)));
    expect(large.aoMgNPerDay).toBeGreaterThan(small.aoMgNPerDay);
    const byLoad = steadyStateCapacity(parseScenario(matureWithPlaties(10)), { loadMgNPerDay: 30 });
    // Capacity at saturating food exceeds the load it oxidises at the low steady TAN (Monod, MODEL.md §3.2).
    expect(byLoad.aoMgNPerDay).toBeGreaterThan(30);
  });

  it('reports a load the zones cannot carry as a ScenarioError', () => {
    expect(() => steadyStateCapacity(parseScenario(matureWithPlaties(10)), { loadMgNPerDay: 1e6 })).toThrow(ScenarioError);
  });
});
