import { describe, expect, it } from 'vitest';
import { forecast } from '@/simulation/forecast';
import { parseScenario, ScenarioError, type ScenarioEvent } from '@/simulation/scenario';
import { defaultHorizonDays, lastActionDay, routineWaterChangeFor, startFor, tankScenario, zonesForSetup, type ScenarioTank } from '@/shared/tank-scenario';

const ID = '00000000-0000-4000-8000-000000000001';

/** An invented 120 L planted community tank with a canister (like the demo seed's). */
function communityTank(over: Partial<ScenarioTank> = {}): ScenarioTank {
  return {
    volumeL: 120,
    temperatureC: 25,
    ph: 7.2,
    khDkh: 5,
    tapWater: { tanMgN: 0.2, no2MgN: 0, no3MgN: 2 },
    setup: {
      filter: { kind: 'canister', mediaVolumeL: 1.5, media: 'ceramic-rings' },
      substrate: { grain: 'sand', depthCm: 5 },
      hardscape: 'some',
      plants: 'moderate',
      lightHoursPerDay: 8,
    },
    livestock: [
      { id: ID, speciesId: 'neon-tetra', customName: null, count: 12, lengthCm: 3 },
      { id: ID, speciesId: 'bronze-corydoras', customName: null, count: 6, lengthCm: 5.5 },
    ],
    readings: [null, null],
    ...over,
  };
}

const addRasboras = (day: number, count = 4): ScenarioEvent => ({
  type: 'add-fish',
  day,
  fish: [{ species: 'harlequin-rasbora', count, lengthCm: 3 }],
});

describe('startFor', () => {
  it('starts a tank with fish as mature at its present load', () => {
    expect(startFor(communityTank())).toEqual({ start: { kind: 'mature' }, startReason: 'mature-present-load' });
  });

  it('starts a tank with no fish and no tests as new and unseeded', () => {
    expect(startFor(communityTank({ livestock: [], readings: [] }))).toEqual({ start: { kind: 'new' }, startReason: 'new-unseeded' });
  });

  it('starts an empty tank with a test history as new, and says it had no fish', () => {
    expect(startFor(communityTank({ livestock: [] })).startReason).toBe('new-no-fish');
  });

  it('treats a livestock row with count 0 as no fish', () => {
    const tank = communityTank({ livestock: [{ id: ID, speciesId: 'guppy', customName: null, count: 0, lengthCm: null }], readings: [] });
    expect(startFor(tank).start.kind).toBe('new');
  });
});

describe('tankScenario', () => {
  it('builds a scenario the engine accepts, with the tank chemistry and tap water', () => {
    const { scenario } = tankScenario(communityTank(), { events: [addRasboras(0)] });
    const parsed = parseScenario(scenario);
    expect(parsed.tank.volumeL).toBe(120);
    expect(parsed.tank.ph).toBe(7.2);
    expect(parsed.tank.khDegrees).toBe(5);
    expect(parsed.tank.tapWater).toMatchObject({ tanMgN: 0.2, no2MgN: 0, no3MgN: 2 });
    expect(parsed.tank.plants).toBe('moderate');
  });

  it('puts the stored livestock in the tank at day 0', () => {
    const { scenario } = tankScenario(communityTank());
    expect(scenario.fish).toEqual([
      { species: 'neon-tetra', count: 12, lengthCm: 3 },
      { species: 'bronze-corydoras', count: 6, lengthCm: 5.5 },
    ]);
  });

  it('builds filter, substrate and surface zones from the setup description', () => {
    const ids = zonesForSetup(communityTank()).zones.map((z) => z.id);
    expect(ids).toEqual(['filter', 'substrate', 'surfaces']);
  });

  it('gives a bare-bottom tank no substrate zone', () => {
    const tank = communityTank({ setup: { filter: { kind: 'sponge', mediaVolumeL: 0.4 }, substrate: 'bare', hardscape: 'none' } });
    expect(zonesForSetup(tank).zones.map((z) => z.id)).toEqual(['filter', 'surfaces']);
  });

  it('gives a tank with lots of rock more surface area than one with none (presets.ts hardscape shares)', () => {
    const area = (hardscape: 'none' | 'lots') =>
      zonesForSetup(communityTank({ setup: { filter: { kind: 'sponge', mediaVolumeL: 0.4 }, substrate: 'bare', hardscape } })).zones.find((z) => z.id === 'surfaces')!.areaM2!;
    expect(area('lots')).toBeGreaterThan(area('none'));
  });

  it('uses explicit zones from the setup when the keeper gave them', () => {
    const zones = [{ id: 'box', kind: 'filter' as const, areaM2: 2 }];
    expect(zonesForSetup(communityTank({ setup: { zones } })).zones).toEqual(zones);
  });

  it('builds surfaces only for a tank described without a filter', () => {
    const built = zonesForSetup(communityTank({ setup: {} }));
    expect(built.zones.map((z) => z.kind)).toEqual(['surfaces']);
    expect(built.aeration).toBe('gentle');
  });

  it('leaves KH out when the tank has none recorded, so pH stays fixed', () => {
    const { scenario } = tankScenario(communityTank({ khDkh: null }));
    expect(scenario.tank.khDegrees).toBeUndefined();
  });

  it('copies the plan events rather than sharing them', () => {
    const events = [addRasboras(3)];
    const { scenario } = tankScenario(communityTank(), { events });
    (scenario.events![0] as { day: number }).day = 9;
    expect(events[0].day).toBe(3);
  });

  it('honours a start state the caller gives', () => {
    const built = tankScenario(communityTank(), { events: [] }, { start: { kind: 'new' } });
    expect(built.start).toEqual({ kind: 'new' });
    expect(built.startReason).toBe('given');
  });

  it('refuses a custom animal without a length, naming its livestock row', () => {
    const tank = communityTank({ livestock: [{ id: ID, speciesId: null, customName: 'Mystery loach', count: 2, lengthCm: null }] });
    try {
      tankScenario(tank);
      expect.fail('should throw');
    } catch (e) {
      expect(e).toBeInstanceOf(ScenarioError);
      expect((e as ScenarioError).fields).toHaveProperty('livestock.0.lengthCm');
    }
  });

  it('refuses a zero volume with a field error instead of NaN zones', () => {
    expect(() => tankScenario(communityTank({ volumeL: 0 }))).toThrow(ScenarioError);
  });

  it('forecasts a mature tank without its own fish pushing ammonia over the practice limit (MODEL.md §3.8)', () => {
    // A settled tank at its present load stays near zero TAN (MODEL.md §3.8: the settled start).
    const result = forecast(tankScenario(communityTank()).scenario);
    expect(result.summary.peaks.tan.value).toBeLessThan(0.5);
  });

  it('forecasts an unseeded tank with the same fish rising well above the mature one (MODEL.md §9.2: new-tank spike)', () => {
    const mature = forecast(tankScenario(communityTank()).scenario).summary.peaks.tan.value;
    const fresh = forecast(tankScenario(communityTank(), { events: [] }, { start: { kind: 'new' } }).scenario).summary.peaks.tan.value;
    expect(fresh).toBeGreaterThan(mature * 3);
  });
});

describe('horizon', () => {
  it('runs three weeks past the last event', () => {
    expect(defaultHorizonDays([addRasboras(0), addRasboras(14)])).toBe(35);
  });

  it('gives at least 30 days for a plan with no events', () => {
    expect(defaultHorizonDays([])).toBe(30);
  });

  it('counts a repeating dose to its last repeat', () => {
    const dose: ScenarioEvent = { type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 0.5 }, repeatEveryDays: 2, repeatCount: 10 };
    expect(lastActionDay(dose)).toBe(18);
  });

  it('counts a split dose to its last part and a continuous dose to the end of its flow', () => {
    const base: ScenarioEvent = { type: 'ammonia-dose', day: 2, amount: { unit: 'mgN-per-L', value: 0.5 }, repeatEveryDays: 1, repeatCount: 10 };
    expect(lastActionDay({ ...base, timesPerDay: 4 })).toBe(11.75);
    expect(lastActionDay({ ...base, delivery: 'continuous' })).toBe(12);
    expect(lastActionDay({ type: 'ammonia-dose', day: 2, amount: { unit: 'mgN-per-L', value: 0.5 }, delivery: 'continuous' })).toBe(3);
  });

  it('caps the horizon at a year', () => {
    expect(defaultHorizonDays([addRasboras(3000)])).toBe(365);
  });
});

describe('routine water changes', () => {
  it('assumes the common weekly 25 % when the keeper has not said (common practice)', () => {
    expect(routineWaterChangeFor({})).toEqual({ routineWaterChange: { percent: 25, everyDays: 7 } });
  });

  it('follows the keeper\'s own routine, and leaves it out for a keeper who does none', () => {
    expect(routineWaterChangeFor({ routineWaterChange: { percent: 40, everyDays: 10 } })).toEqual({ routineWaterChange: { percent: 40, everyDays: 10 } });
    expect(routineWaterChangeFor({ routineWaterChange: { percent: 0, everyDays: 7 } })).toEqual({});
  });

  it('puts it on the scenario\'s tank, not among the plan\'s events', () => {
    const { scenario } = tankScenario(communityTank(), { events: [addRasboras(3)] });
    expect(scenario.tank.routineWaterChange).toEqual({ percent: 25, everyDays: 7 });
    expect(scenario.events).toHaveLength(1);
  });

  it('keeps the pH of a stocked tank with low carbonate hardness from drifting down (alkalinity: 7.14 mg CaCO3 per mg N, US EPA 1975)', () => {
    const none = tankScenario({ ...communityTank(), khDkh: 3, setup: { ...communityTank().setup, routineWaterChange: { percent: 0, everyDays: 7 } } }, { events: [] }, { horizonDays: 60 });
    const weekly = tankScenario({ ...communityTank(), khDkh: 3, setup: { ...communityTank().setup, routineWaterChange: { percent: 30, everyDays: 7 } } }, { events: [] }, { horizonDays: 60 });
    const phNone = forecast(none.scenario).series.ph.at(-1)!;
    const phWeekly = forecast(weekly.scenario).series.ph.at(-1)!;
    expect(phWeekly).toBeGreaterThan(phNone);
  });
});
