import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { planCreateSchema } from '../../shared/schemas/plan';
import { eventSchema, parseScenario, scenarioSchema, ScenarioError, tankSchema } from '../../simulation/scenario';
import { rescueRequestSchema } from '../../simulation/advice/schemas';
import { forecast } from '../../simulation/forecast';
import { countTimelineEntries, MAX_ENSEMBLE_WORK, MAX_TIMELINE_ENTRIES, overBudgetFields, overEnsembleBudgetFields } from '../../simulation/work-budget';

const example = JSON.parse(fs.readFileSync(path.resolve(process.cwd(), 'simulation/examples/big-purchase.json'), 'utf8'));
const dose = (extra: object) => ({ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 0.5 }, ...extra });
const withEvents = (events: object[], horizonDays?: number) => ({ ...example, horizonDays, events });

describe('the work budget counts a forecast before building it', () => {
  it('counts a repeated dose to the horizon, or to its repeat count when that comes first', () => {
    const s = { tank: {}, events: [dose({ repeatEveryDays: 1 }), dose({ repeatEveryDays: 1, repeatCount: 5 })] } as never;
    expect(countTimelineEntries(s, 10).entries).toBe(11 + 5);
  });

  it('counts routine water changes, the ends of medications and one entry per other event', () => {
    const s = {
      tank: { routineWaterChange: { everyDays: 7 } },
      events: [{ type: 'medication', day: 1 }, { type: 'water-change', day: 2 }, { type: 'temperature', day: 40 }],
    } as never;
    // 4 routine changes in 30 days, 2 for the medication, 1 water change; the day-40 event is past the horizon.
    expect(countTimelineEntries(s, 30)).toEqual({ entries: 7, largest: { path: ['tank', 'routineWaterChange', 'everyDays'], entries: 4 } });
  });

  it('names the repeat that adds the most entries', () => {
    const s = { tank: { routineWaterChange: { everyDays: 1 } }, events: [dose({ repeatEveryDays: 2 }), dose({ repeatEveryDays: 0.25 })] } as never;
    expect(countTimelineEntries(s, 365).largest.path).toEqual(['events', 1, 'repeatEveryDays']);
  });

  it('refuses a forecast over the cap with a ScenarioError naming that field, before any solving', () => {
    // What the schema once accepted: a dose every 1e-9 days, no count (~1e10 entries, out of memory after 40 s).
    const s = parseScenario(withEvents([]));
    s.events.push(dose({ repeatEveryDays: 1e-9 }) as never);
    const t0 = performance.now();
    let error: unknown;
    try {
      forecast(s as never, { horizonDays: 365 });
    } catch (e) {
      error = e;
    }
    expect(performance.now() - t0).toBeLessThan(100);
    expect(error).toBeInstanceOf(ScenarioError);
    expect(Object.keys((error as ScenarioError).fields)).toEqual(['events.0.repeatEveryDays']);
  });

  it('lets the worst dose schedule the schema accepts through: four doses a day for a year', () => {
    expect(overBudgetFields({ tank: {}, events: [dose({ repeatEveryDays: 0.25 })] }, 365)).toBeNull();
    const f = forecast(withEvents([dose({ repeatEveryDays: 0.25 })], 365));
    expect(f.stats.segments).toBeGreaterThanOrEqual(1460);
  });

  it('refuses an ensemble whose members times work exceed the budget, naming members', () => {
    const s = { tank: {}, events: [] };
    expect(overEnsembleBudgetFields(s, 60, 1024, 'members')).toBeNull();
    const over = overEnsembleBudgetFields(s, 365, 1024, 'members');
    expect(Object.keys(over ?? {})).toEqual(['members']);
    expect(365 * 1024).toBeGreaterThan(MAX_ENSEMBLE_WORK);
  });
});

describe('the schemas hold physical minimums on repeats, steps and durations', () => {
  const eventIssue = (event: object) => {
    const r = eventSchema.safeParse(event);
    return r.success ? null : r.error.issues[0]!.path.join('.');
  };

  it('refuses a dose repeated more often than every 6 hours, and accepts every 6 hours', () => {
    expect(eventIssue(dose({ repeatEveryDays: 1e-9 }))).toBe('repeatEveryDays');
    expect(eventIssue(dose({ repeatEveryDays: 0.2 }))).toBe('repeatEveryDays');
    expect(eventIssue(dose({ repeatEveryDays: 0.25 }))).toBeNull();
  });

  it('refuses a split dose beyond 8 parts a day (3 h apart) or not whole, naming timesPerDay with a message that says why', () => {
    const issue = (event: object) => {
      const r = eventSchema.safeParse(event);
      return r.success ? null : `${r.error.issues[0]!.path.join('.')}: ${r.error.issues[0]!.message}`;
    };
    expect(issue(dose({ timesPerDay: 9, repeatEveryDays: 1 }))).toMatch(/^timesPerDay: timesPerDay is at most 8 \(3 h apart\)/);
    expect(issue(dose({ timesPerDay: 0 }))).toMatch(/^timesPerDay: timesPerDay must be at least 1/);
    expect(issue(dose({ timesPerDay: 2.5 }))).toMatch(/^timesPerDay: timesPerDay must be a whole number/);
    expect(issue(dose({ timesPerDay: 8, repeatEveryDays: 1 }))).toBeNull();
  });

  it('refuses a split or continuous dose repeated less than a day apart, a split continuous dose, and an unknown delivery', () => {
    const path = (event: object) => eventIssue(event);
    expect(path(dose({ timesPerDay: 4, repeatEveryDays: 0.5 }))).toBe('repeatEveryDays');
    expect(path(dose({ delivery: 'continuous', repeatEveryDays: 0.25 }))).toBe('repeatEveryDays');
    expect(path(dose({ delivery: 'continuous', timesPerDay: 4 }))).toBe('timesPerDay');
    expect(path(dose({ delivery: 'drip' }))).toBe('delivery');
    expect(path(dose({ delivery: 'continuous', repeatEveryDays: 1, repeatCount: 30 }))).toBeNull();
    // Through the scenario, the engine's ScenarioError names the event's field.
    let error: unknown;
    try {
      parseScenario(withEvents([dose({ timesPerDay: 4, repeatEveryDays: 0.5 })]));
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(ScenarioError);
    expect(Object.keys((error as ScenarioError).fields)).toEqual(['events.0.repeatEveryDays']);
  });

  it('refuses a year of doses split 8 a day over the budget, naming timesPerDay; continuous delivery of the same fits in 2 entries', () => {
    const r = scenarioSchema.safeParse(withEvents([dose({ timesPerDay: 8, repeatEveryDays: 1 })], 365));
    expect(r.success ? null : r.error.issues[0]!.path.join('.')).toBe('events.0.timesPerDay');
    expect(r.success ? '' : r.error.issues[0]!.message).toMatch(/give them continuously/);
    expect(countTimelineEntries({ tank: {}, events: [dose({ delivery: 'continuous', repeatEveryDays: 1 })] }, 365).entries).toBe(2);
  });

  it('refuses medications and aeration losses shorter than an hour', () => {
    expect(eventIssue({ type: 'medication', day: 0, durationDays: 1e-9, oxidationMultiplier: 0.5 })).toBe('durationDays');
    expect(eventIssue({ type: 'aeration-loss', day: 0, durationDays: 0.01, oxygenShare: 0.5 })).toBe('durationDays');
    expect(eventIssue({ type: 'aeration-loss', day: 0, durationDays: 1 / 24, oxygenShare: 0.5 })).toBeNull();
  });

  it('refuses routine water changes more often than daily', () => {
    const tank = { ...example.tank, routineWaterChange: { percent: 25, everyDays: 0.5 } };
    const r = tankSchema.safeParse(tank);
    expect(r.success ? null : r.error.issues[0]!.path.join('.')).toBe('routineWaterChange.everyDays');
  });

  it('refuses a rescue step that is not a whole percent', () => {
    const r = rescueRequestSchema.safeParse({ scenario: example, stepPercent: 0.5 });
    expect(r.success ? null : r.error.issues[0]!.path.join('.')).toBe('stepPercent');
    expect(rescueRequestSchema.safeParse({ scenario: example, stepPercent: 1 }).success).toBe(true);
  });

  it('refuses a scenario whose events exceed the budget over its own horizon, naming the repeat', () => {
    const many = Array.from({ length: 2 }, () => dose({ repeatEveryDays: 0.25 }));
    const r = scenarioSchema.safeParse(withEvents(many, 365));
    expect(r.success).toBe(false);
    expect(r.success ? null : r.error.issues[0]!.path.join('.')).toBe('events.0.repeatEveryDays');
    expect(2 * 1461).toBeGreaterThan(MAX_TIMELINE_ENTRIES);
  });

  it('refuses saving a plan whose events exceed the budget over the longest plan horizon', () => {
    const plan = { name: 'Dosing', startDate: '2026-01-10', events: [dose({ repeatEveryDays: 0.25 }), dose({ day: 1, repeatEveryDays: 0.25 })] };
    const r = planCreateSchema.safeParse(plan);
    expect(r.success ? null : r.error.issues[0]!.path.join('.')).toBe('events.0.repeatEveryDays');
    expect(planCreateSchema.safeParse({ ...plan, events: plan.events.slice(0, 1) }).success).toBe(true);
  });
});
