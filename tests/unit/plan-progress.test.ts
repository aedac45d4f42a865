import { describe, expect, it } from 'vitest';
import { checkDayProgress, daysBetween, localDate, nextCheckDay, planProgress, readingDay, readingsBesideForecast, seriesAt } from '@/lib/plan-progress';
import { planCheckDays } from '@/shared/plan-check-days';
import { livestockCounts, stockCounts } from '@/shared/stock-counts';
import { tankOverview } from '@/lib/tank-next-action';
import type { ReadingItem, TankDetail } from '@/shared/schemas/tank';

/** Local times, so the tests hold in any time zone the runner has. */
const at = (date: string, hour = 9) => {
  const [y, m, d] = date.split('-').map(Number);
  return new Date(y, m - 1, d, hour);
};
const reading = (date: string, over: Partial<ReadingItem> = {}): ReadingItem => ({
  id: `r-${date}-${over.tanMgN ?? 0}`,
  takenAt: at(date).toISOString(),
  tanMgN: 0.25,
  no2MgN: 0.05,
  no3MgN: 5,
  ph: 7.2,
  temperatureC: 25,
  khDkh: 4,
  basis: 'N',
  ...over,
});
const neons = { type: 'add-fish' as const, day: 0, fish: [{ species: 'neon-tetra', count: 8, lengthCm: 3 }] };

describe('check days of a started plan', () => {
  const checkDays = planCheckDays([neons], '2026-03-01');

  it('marks a day with a test done, a past day without one missed, today due, and later days to come', () => {
    const progress = checkDayProgress(checkDays, new Set(['2026-03-01', '2026-03-03']), '2026-03-04', null);
    // Check days after a new load: a baseline on day 0, then 1, 2, 3, 5, 7, 10, 14 (common practice).
    expect(progress.map((c) => c.day)).toEqual([0, 1, 2, 3, 5, 7, 10, 14]);
    expect(progress.find((c) => c.day === 0)!.state).toBe('done');
    expect(progress.find((c) => c.day === 1)!.state).toBe('missed');
    expect(progress.find((c) => c.day === 2)!.state).toBe('done');
    expect(progress.find((c) => c.day === 3)!.state).toBe('due');
    expect(progress.find((c) => c.day === 5)!.state).toBe('upcoming');
    expect(nextCheckDay(progress)?.day).toBe(3);
  });

  it('calls the days after a plan was marked done not needed, and leaves no next check day', () => {
    const p = planProgress({ startDate: '2026-03-01', checkDays, finishedAt: at('2026-03-05', 20).toISOString() }, [reading('2026-03-01')], at('2026-03-20'), 20);
    expect(p.checkDays.find((c) => c.day === 7)!.state).toBe('not-needed');
    expect(p.checkDays.find((c) => c.day === 3)!.state).toBe('missed');
    expect(p).toMatchObject({ today: 19, done: 1, next: null });
  });

  it('counts plan days in the local calendar and places a test at its fraction of a day', () => {
    expect(daysBetween('2026-03-01', '2026-03-04')).toBe(3);
    expect(readingDay(at('2026-03-03', 12).toISOString(), '2026-03-01')).toBeCloseTo(2.5, 6);
    expect(localDate(at('2026-12-31', 23))).toBe('2026-12-31');
  });
});

describe('tests beside the forecast', () => {
  it('interpolates the forecast linearly at the moment of each test, and gives null outside it', () => {
    expect(seriesAt([0, 1, 2], [0, 1, 3], 1.5)).toBeCloseTo(2, 12);
    expect(seriesAt([0, 1, 2], [0, 1, 3], 3)).toBeNull();
    const view = { days: [0, 1, 2, 3], tanMgN: [0, 0.2, 0.4, 0.6], no2MgN: [0, 0, 0.1, 0.2], no3MgN: [1, 1, 1, 1] };
    const [row] = readingsBesideForecast([reading('2026-03-03', { tanMgN: 0.9, takenAt: at('2026-03-03', 12).toISOString() })], view, '2026-03-01');
    expect(row.day).toBeCloseTo(2.5, 6);
    expect(row.tanMgN).toEqual({ measured: 0.9, forecast: expect.closeTo(0.5, 9) });
    expect(row.no2MgN.forecast).toBeCloseTo(0.15, 9);
  });
});

describe('stock counts', () => {
  it('counts catalogue shrimp and snails apart from fish, and one species per kind', () => {
    expect(
      livestockCounts([
        { speciesId: 'neon-tetra', customName: null, count: 8 },
        { speciesId: 'neon-tetra', customName: null, count: 2 },
        { speciesId: 'cherry-shrimp', customName: null, count: 20 },
        { speciesId: null, customName: 'Odd loach', count: 1 },
      ]),
    ).toEqual({ fish: 11, invertebrates: 20, species: 3 });
    expect(stockCounts([])).toEqual({ fish: 0, invertebrates: 0, species: 0 });
  });
});

describe('the tank page’s next action', () => {
  const base: TankDetail = {
    id: 't',
    name: 'Lounge',
    volumeL: 120,
    temperatureC: 25,
    ph: 7.2,
    khDkh: 4,
    tapWater: { tanMgN: 0, no2MgN: 0, no3MgN: 0 },
    setup: {},
    notes: '',
    livestock: [{ id: 'l', speciesId: 'neon-tetra', customName: null, count: 8, lengthCm: 3 }],
    readings: [],
    plans: [],
    history: null,
    fit: null,
  };
  const running = { id: 'p', name: 'More neons', startDate: '2026-03-01', status: 'active' as const, startedAt: at('2026-03-01').toISOString(), finishedAt: null, events: [neons] };

  it('asks for today’s test on a check day of the running plan until one is logged, then points at the next check day', () => {
    const tank = { ...base, plans: [running], readings: [reading('2026-03-02'), reading('2026-03-01')] };
    const due = tankOverview(tank, at('2026-03-03', 8));
    expect(due.action).toMatchObject({ kind: 'log-test', label: "Log today's test" });
    expect(due.action.why).toContain('Day 2 of “More neons”');
    const tested = tankOverview({ ...tank, readings: [reading('2026-03-03'), ...tank.readings] }, at('2026-03-03', 18));
    expect(tested.action).toMatchObject({ kind: 'open-plan', planId: 'p' });
    expect(tested.action.why).toMatch(/^Next test day: tomorrow \(day 3\)/);
  });

  it('asks for a first test when animals live in the tank, and offers a plan when the water is tested and nothing runs', () => {
    expect(tankOverview(base, at('2026-03-03')).action.kind).toBe('log-test');
    const tested = tankOverview({ ...base, readings: [reading('2026-03-03')] }, at('2026-03-03', 18));
    expect(tested.action).toMatchObject({ kind: 'plan-change', label: 'Plan a change' });
    // An empty tank: no nagging for tests, the first plan is what to do.
    expect(tankOverview({ ...base, livestock: [] }, at('2026-03-03')).action.kind).toBe('plan-change');
  });
});
