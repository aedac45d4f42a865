import { describe, expect, it } from 'vitest';
import { forecast } from '@/simulation/forecast';
import { ScenarioError, type ScenarioInput } from '@/simulation/scenario';
import { matureWithPlaties, tank } from './scenarios';

/** Day-0 capacities (mg N/day) per zone of a scenario. */
function day0(s: ScenarioInput): Record<string, { ao: number; no: number }> {
  const f = forecast({ ...s, horizonDays: 1 });
  return Object.fromEntries(f.series.zones.map((z) => [z.zoneId, { ao: z.ao[0], no: z.no[0] }]));
}

const platies = [{ species: 'platy', count: 10 }];

describe("a starved start (filter mature until some days ago, no fish since: simulation/forecast/starved-start.ts)", () => {
  it('equals the same mature tank whose fish all left on day 0, after as many days (the engine\'s own event path)', () => {
    const days = 12;
    const emptied = forecast({ ...matureWithPlaties(10, [{ type: 'remove-fish', day: 0, species: 'platy', count: 10 }]), horizonDays: days });
    const starved = day0({ tank: tank(), start: { kind: 'starved', formerFish: platies, starvedDays: days } });
    for (const z of emptied.series.zones) {
      expect(starved[z.zoneId].ao).toBeCloseTo(z.ao.at(-1)!, 1);
      expect(starved[z.zoneId].no).toBeCloseTo(z.no.at(-1)!, 1);
      if (z.ao.at(-1)! > 1e-6) expect(Math.abs(starved[z.zoneId].ao / z.ao.at(-1)! - 1)).toBeLessThan(0.01);
      if (z.no.at(-1)! > 1e-6) expect(Math.abs(starved[z.zoneId].no / z.no.at(-1)! - 1)).toBeLessThan(0.01);
    }
  });

  it('is the mature tank at 0 days, and loses capacity the longer it starves', () => {
    const mature = day0(matureWithPlaties(10));
    const at = (d: number) => day0({ tank: tank(), start: { kind: 'starved', formerFish: platies, starvedDays: d } }).filter.ao;
    expect(at(0)).toBeCloseTo(mature.filter.ao, 6);
    expect(at(7)).toBeLessThan(at(0));
    expect(at(30)).toBeLessThan(at(7));
    expect(at(3650)).toBeGreaterThanOrEqual(0);
  });

  it('takes the day-0 water the keeper measured over what the starved days leave', () => {
    const f = forecast({ tank: tank(), start: { kind: 'starved', formerFish: platies, starvedDays: 5 }, initialWater: { tanMgN: 1.5, no2MgN: 0.4 }, horizonDays: 2 });
    expect(f.series.tanMgN[0]).toBeCloseTo(1.5, 9);
    expect(f.series.no2MgN[0]).toBeCloseTo(0.4, 9);
  });

  it('needs the former load or the fish that made it, named on the field', () => {
    expect(() => forecast({ tank: tank(), start: { kind: 'starved', starvedDays: 5 } })).toThrow(ScenarioError);
    try {
      forecast({ tank: tank(), start: { kind: 'starved', starvedDays: 5 } });
    } catch (e) {
      expect(Object.keys((e as ScenarioError).fields)).toEqual(['start.formerFish']);
    }
  });
});

describe('a seeded start (new tank, filter media from a mature filter)', () => {
  it("gives the filter its share of a mature filter's capacity at the load, and the other zones a new tank's", () => {
    const mature = day0(matureWithPlaties(10));
    const fresh = day0({ tank: tank(), start: { kind: 'new' }, fish: platies });
    const seeded = day0({ tank: tank(), start: { kind: 'seeded', share: 0.4 }, fish: platies });
    expect(seeded.filter.ao).toBeCloseTo(0.4 * mature.filter.ao, 6);
    expect(seeded.filter.no).toBeCloseTo(0.4 * mature.filter.no, 6);
    expect(seeded.surfaces.ao).toBeCloseTo(fresh.surfaces.ao, 9);
  });

  it('with no fish at day 0, is seeded for the fish the plan adds', () => {
    const mature = day0(matureWithPlaties(10));
    const seeded = day0({ tank: tank(), start: { kind: 'seeded', share: 1 }, events: [{ type: 'add-fish', day: 0.5, fish: platies[0] }] });
    expect(seeded.filter.ao).toBeCloseTo(mature.filter.ao, 6);
  });
});
