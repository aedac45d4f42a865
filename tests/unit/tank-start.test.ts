import { describe, expect, it } from 'vitest';
import { startEvidence, startTest, TEST_START_MAX_DAYS, type EvidenceTank } from '@/shared/tank-start';
import { startLine, startWarningLines } from '@/shared/start-words';
import { tankScenario, type ScenarioTank } from '@/shared/tank-scenario';
import { ionToN } from '@/simulation/units';

const ZONES = [{ id: 'filter' }, { id: 'substrate' }];
const START = '2026-12-03';
const at = (iso: string) => `${iso}`;
const test = (takenAt: string, tanMgN: number | null, no2MgN: number | null = 0, no3MgN: number | null = 5) => ({ takenAt: at(takenAt), tanMgN, no2MgN, no3MgN });
const FIT = {
  fittedAt: '2026-12-01T09:00:00.000Z',
  capacities: [
    { zoneId: 'filter', aoMgNPerDay: 300, noMgNPerDay: 250 },
    { zoneId: 'substrate', aoMgNPerDay: 20, noMgNPerDay: 15 },
  ],
};

function tank(over: Partial<EvidenceTank> = {}): EvidenceTank {
  return { ph: 7.2, temperatureC: 25, livestock: [{ count: 12 }], readings: [], history: null, fit: null, ...over };
}

describe('startTest: the test that gives the day-0 water', () => {
  it(`is the latest up to the end of the start day, used when at most ${TEST_START_MAX_DAYS} days old`, () => {
    const readings = [test('2026-12-04T08:00:00Z', 3), test('2026-12-03T20:00:00Z', 2), test('2026-11-20T08:00:00Z', 0)];
    expect(startTest(readings, START)).toMatchObject({ takenAt: '2026-12-03T20:00:00Z', tanMgN: 2, used: true, daysBefore: 0 });
    expect(startTest([test('2026-11-30T00:00:00Z', 1)], START)).toMatchObject({ used: true, daysBefore: 3 });
    expect(startTest([test('2026-11-29T23:00:00Z', 1)], START)).toMatchObject({ used: false });
  });

  it('skips tests with no nitrogen value, and is null when there is none before the start day', () => {
    expect(startTest([{ takenAt: '2026-12-02T08:00:00Z', tanMgN: null, no2MgN: null, no3MgN: null }, test('2026-12-01T08:00:00Z', 1)], START)?.takenAt).toBe('2026-12-01T08:00:00Z');
    expect(startTest([test('2026-12-05T08:00:00Z', 1)], START)).toBeNull();
  });
});

describe('startEvidence: test, then fit, then the keeper\'s account, then the default', () => {
  it('takes the water from a recent test and the nitrifiers from an applied fit over the account and the default', () => {
    const e = startEvidence(tank({ readings: [test('2026-12-03T07:00:00Z', 2, 1, null)], fit: FIT, history: { kind: 'new' } }), ZONES, START);
    expect(e.initialWater).toEqual({ tanMgN: 2, no2MgN: 1 });
    expect(e.start).toEqual({ kind: 'explicit', capacities: FIT.capacities });
    expect(e.state.reason).toBe('fitted');
    expect(e.state.fittedAt).toBe(FIT.fittedAt);
  });

  it("uses the keeper's account when no fit is applied, and the default only when there is no account", () => {
    expect(startEvidence(tank({ history: { kind: 'new' } }), ZONES, START).start).toEqual({ kind: 'new' });
    expect(startEvidence(tank({ history: { kind: 'seeded', sharePercent: 30 } }), ZONES, START).start).toEqual({ kind: 'seeded', share: 0.3 });
    expect(startEvidence(tank({ livestock: [], history: { kind: 'settled' } }), ZONES, START).state.reason).toBe('described-settled');
    const emptied = startEvidence(tank({ livestock: [], history: { kind: 'emptied', matureUntil: '2026-11-19', formerFish: [{ speciesId: 'platy', count: 8 }] } }), ZONES, START);
    expect(emptied.start).toEqual({ kind: 'starved', formerFish: [{ species: 'platy', count: 8 }], starvedDays: 14 });
    expect(startEvidence(tank(), ZONES, START).state.reason).toBe('mature-present-load');
    expect(startEvidence(tank({ livestock: [] }), ZONES, START).state.reason).toBe('new-unseeded');
  });

  it('does not use a fit made on other zones than the tank has now (one more, one fewer), and says so', () => {
    for (const capacities of [[...FIT.capacities, { zoneId: 'sump', aoMgNPerDay: 1, noMgNPerDay: 1 }], FIT.capacities.slice(0, 1)]) {
      const e = startEvidence(tank({ fit: { ...FIT, capacities } }), ZONES, START);
      expect(e.state.reason).toBe('mature-present-load');
      expect(e.state.warnings).toEqual([{ kind: 'fit-other-zones', fittedAt: FIT.fittedAt }]);
    }
  });

  it('warns when the latest test is too old, and starts without it', () => {
    const e = startEvidence(tank({ readings: [test('2026-11-23T08:00:00Z', 2)] }), ZONES, START);
    expect(e.initialWater).toEqual({});
    expect(e.state.warnings).toEqual([{ kind: 'test-old', takenAt: '2026-11-23T08:00:00Z', daysBefore: 10 }]);
  });

  it('warns when a settled tank tests at half a limit or more (the one water-test judgement), not when it reads near zero', () => {
    const high = startEvidence(tank({ readings: [test('2026-12-03T07:00:00Z', 2, 1)] }), ZONES, START);
    expect(high.state.warnings.map((w) => w.kind)).toEqual(['test-contradicts-settled']);
    expect(startEvidence(tank({ readings: [test('2026-12-03T07:00:00Z', 0, 0)] }), ZONES, START).state.warnings).toEqual([]);
    // A new tank reading ammonia is what a new tank does: no contradiction.
    expect(startEvidence(tank({ history: { kind: 'new' }, readings: [test('2026-12-03T07:00:00Z', 2, 1)] }), ZONES, START).state.warnings).toEqual([]);
  });
});

describe('the start line', () => {
  const state = startEvidence(tank({ readings: [test('2026-12-03T07:00:00Z', 2, 1, null)] }), ZONES, START).state;

  it("says in one line what the forecast started from, in the keeper's basis", () => {
    expect(startLine(state, 'N')).toBe('From your test of 3 Dec: total ammonia 2, nitrite 1 mg/L as N, in a settled tank whose nitrifiers match the fish it holds now.');
    // As the ion: 2 mg N/L of ammonium-N is 2.58 mg NH4+/L, 1 mg N/L of nitrite-N is 3.28 mg NO2−/L (molar masses, simulation/units.ts).
    expect(ionToN(2.58, 'NH4')).toBeCloseTo(2, 2);
    expect(startLine(state, 'ion')).toMatch(/total ammonia 2\.6, nitrite 3\.3 \(mg\/L NH4\+, mg\/L NO2−, mg\/L NO3−\)/);
  });

  it('words each warning once', () => {
    expect(startWarningLines(state, 'N')).toEqual([expect.stringMatching(/^Your test of 3 Dec shows total ammonia 2, nitrite 1 mg\/L as N, which a settled tank does not read/)]);
  });
});

describe('tankScenario with a start date', () => {
  const scenarioTank: ScenarioTank = {
    volumeL: 120,
    temperatureC: 25,
    ph: 7.2,
    khDkh: null,
    tapWater: { tanMgN: 0, no2MgN: 0, no3MgN: 0 },
    setup: { filter: { kind: 'canister', mediaVolumeL: 1.5 } },
    livestock: [{ id: '00000000-0000-4000-8000-000000000001', speciesId: 'neon-tetra', customName: null, count: 12, lengthCm: 3 }],
    readings: [test('2026-12-03T07:00:00Z', 2, 1)],
  };

  it('puts the test into the scenario as its day-0 water; without a start date the tests are not read', () => {
    expect(tankScenario(scenarioTank, { events: [] }, { startDate: START }).scenario.initialWater).toEqual({ tanMgN: 2, no2MgN: 1, no3MgN: 5 });
    expect(tankScenario(scenarioTank).scenario.initialWater).toEqual({});
  });
});
