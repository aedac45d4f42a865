import { describe, expect, it } from 'vitest';
import { openLedger } from '@/simulation/forecast/balance';
import { feedFlowsOf, tankChemistry, type RunConditions } from '@/simulation/forecast/conditions';
import { applyBreakpoint, applyEvent, type EventScope } from '@/simulation/forecast/events';
import { aoIndex, createModel, I_KH, I_NO2, I_NO3, I_ORG, I_TAN, noIndex } from '@/simulation/model';
import { resolveParameters } from '@/simulation/parameters';
import { resolveZone } from '@/simulation/presets';
import { parseScenario, type ScenarioEvent } from '@/simulation/scenario';
import { startUp } from './scenarios';

/** A run's event scope on the invented test tank (KH 6, tap water with some nitrate), water as given. */
function scope(): EventScope {
  const scenario = parseScenario(startUp({ khDegrees: 6, tapWater: { tanMgN: 0, no2MgN: 0, no3MgN: 2, khDegrees: 4 } }));
  const params = resolveParameters();
  const zones = scenario.tank.zones.map(resolveZone);
  const model = createModel(zones, scenario.tank.volumeL, params);
  const y = new Array<number>(model.n).fill(0);
  y[I_TAN] = 2;
  y[I_NO2] = 1;
  y[I_NO3] = 20;
  y[I_ORG] = 0.5;
  y[I_KH] = 6;
  y[aoIndex(0)] = 100;
  y[noIndex(0)] = 80;
  y[aoIndex(1)] = 50;
  const start = { temperatureC: 25, feeding: scenario.feeding, fishMassG: 10 };
  const conditions: RunConditions = { ...start, medications: new Map(), aerationLosses: new Map(), doseFlows: new Map(), feedFlows: feedFlowsOf(start, params, 1) };
  return { tank: scenario.tank, chemistry: tankChemistry(scenario.tank), zones, model, params, feedingMultiplier: 1, y, conditions, ledger: openLedger(model, y) };
}

describe('what each event kind does to a running forecast (simulation/forecast/events.ts)', () => {
  it('a water change mixes in tap water by its share, KH included, and books what left and came in', () => {
    const s = scope();
    applyEvent(s, { type: 'water-change', day: 3, percent: 25 }, 0, 3);
    expect(s.y[I_TAN]).toBeCloseTo(1.5, 12);
    expect(s.y[I_NO2]).toBeCloseTo(0.75, 12);
    expect(s.y[I_NO3]).toBeCloseTo(0.75 * 20 + 0.25 * 2, 12);
    expect(s.y[I_ORG]).toBeCloseTo(0.375, 12);
    expect(s.y[I_KH]).toBeCloseTo(0.75 * 6 + 0.25 * 4, 12);
    const V = s.tank.volumeL;
    expect(s.ledger.balance.waterChangeRemovedMg).toBeCloseTo(0.25 * V * (2 + 1 + 20 + 0.5), 9);
    expect(s.ledger.balance.tapWaterMg).toBeCloseTo(0.25 * V * 2, 9);
  });

  it('an ammonia dose adds its mg N/L at once and is booked with its time', () => {
    const s = scope();
    applyEvent(s, { type: 'ammonia-dose', day: 5, amount: { unit: 'mgN-per-L', value: 1.5 } }, 0, 5);
    expect(s.y[I_TAN]).toBeCloseTo(3.5, 12);
    expect(s.ledger.doses).toEqual([{ from: 5, to: 5, mg: 1.5 * s.tank.volumeL }]);
  });

  it('a split dose adds its 1/n share per pulse; a continuous one sets a flow its end removes, adding nothing at once', () => {
    const s = scope();
    applyEvent(s, { type: 'ammonia-dose', day: 5, amount: { unit: 'mgN-per-L', value: 1.5 }, timesPerDay: 3 }, 0, 5);
    expect(s.y[I_TAN]).toBeCloseTo(2.5, 12);
    applyBreakpoint(s, { time: 5.5, fishMassG: 10, actions: [] });
    const before = s.y.slice();
    const excretionBefore = s.model.current.excretionTan;
    const flow: ScenarioEvent = { type: 'ammonia-dose', day: 6, amount: { unit: 'mgN-per-L', value: 0.4 }, delivery: 'continuous', repeatEveryDays: 1, repeatCount: 3 };
    applyBreakpoint(s, { time: 6, fishMassG: 10, actions: [{ kind: 'event', index: 2, event: flow }] });
    expect(s.y).toEqual(before);
    expect([...s.conditions.doseFlows]).toEqual([[2, 0.4]]);
    expect(s.model.current.excretionTan).toBeCloseTo(excretionBefore + 0.4, 12);
    applyBreakpoint(s, { time: 9, fishMassG: 10, actions: [{ kind: 'end-dose-flow', index: 2 }] });
    expect(s.conditions.doseFlows.size).toBe(0);
    expect(s.model.current.excretionTan).toBeCloseTo(excretionBefore, 12);
  });

  it('a filter rinse takes its share of both populations from that zone only', () => {
    const s = scope();
    expect(s.y[aoIndex(1)]).toBe(50);
    applyEvent(s, { type: 'filter-clean', day: 1, zoneId: 'filter', action: 'rinse', shareLost: 0.3 }, 0, 1);
    expect(s.y[aoIndex(0)]).toBeCloseTo(70, 12);
    expect(s.y[noIndex(0)]).toBeCloseTo(56, 12);
    expect(s.y[aoIndex(1)]).toBe(50);
    const bn = s.model.biomassNPerCapacity;
    expect(s.ledger.balance.mediaCleaningMg).toBeCloseTo(bn.ao * 30 + bn.no * 24, 9);
  });

  it('medication, aeration loss, temperature and feeding change the conditions; their ends restore them', () => {
    const s = scope();
    applyBreakpoint(s, {
      time: 2,
      fishMassG: 10,
      actions: [
        { kind: 'event', index: 4, event: { type: 'medication', day: 2, durationDays: 3, oxidationMultiplier: 0.4 } },
        { kind: 'event', index: 5, event: { type: 'aeration-loss', day: 2, durationDays: 1, oxygenShare: 0.5 } },
        { kind: 'event', index: 6, event: { type: 'temperature', day: 2, temperatureC: 28 } },
        { kind: 'event', index: 7, event: { type: 'feeding', day: 2, feeding: { mode: 'grams', gramsPerDay: 0.2 } } },
      ],
    });
    expect([...s.conditions.medications]).toEqual([[4, 0.4]]);
    expect([...s.conditions.aerationLosses]).toEqual([[5, 0.5]]);
    expect(s.conditions.temperatureC).toBe(28);
    expect(s.conditions.feeding).toEqual({ mode: 'grams', gramsPerDay: 0.2 });
    applyBreakpoint(s, { time: 3, fishMassG: 10, actions: [{ kind: 'end-aeration-loss', index: 5 }, { kind: 'end-medication', index: 4 }] });
    expect(s.conditions.medications.size).toBe(0);
    expect(s.conditions.aerationLosses.size).toBe(0);
  });

  it('fish events leave the water alone; the breakpoint takes the fish mass the timeline summed and refeeds', () => {
    const s = scope();
    const water = s.y.slice();
    const flowsBefore = s.conditions.feedFlows;
    applyBreakpoint(s, { time: 1, fishMassG: 40, actions: [{ kind: 'event', index: 0, event: { type: 'add-fish', day: 1, fish: [{ species: 'platy', count: 10 }] } }] });
    expect(s.y).toEqual(water);
    expect(s.conditions.fishMassG).toBe(40);
    expect(s.conditions.feedFlows.offeredN).toBeGreaterThan(flowsBefore.offeredN);
  });

  it('refuses, loudly, an event kind it has no rule for (the never-check at the end of the switch)', () => {
    const s = scope();
    const unknown = { type: 'lights-off', day: 1 } as unknown as ScenarioEvent;
    expect(() => applyEvent(s, unknown, 0, 1)).toThrow(/no rule for .*lights-off/);
  });
});
