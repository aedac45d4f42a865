import { describe, expect, it } from 'vitest';
import { judgeLatest, levelFor, nextTestDue, ROUTINE_TEST_INTERVAL_DAYS, tankStatus, WATCH_SHARE } from '@/shared/tank-status';
import { limitRecord, NITRITE_PRACTICE_LIMIT_MG_N, tankLimits, type LimitConditions } from '@/simulation/limits';

const limitsAt = (c: LimitConditions) => limitRecord(tankLimits(c), c);

const NOW = new Date('2026-03-10T15:00:00Z');

describe('levelFor', () => {
  it('is ok below half the limit, watch from half, over above the limit', () => {
    expect(WATCH_SHARE).toBe(0.5);
    expect(levelFor(0.049, 0.1)).toBe('ok');
    expect(levelFor(0.05, 0.1)).toBe('watch');
    expect(levelFor(0.1, 0.1)).toBe('watch');
    expect(levelFor(0.1001, 0.1)).toBe('over');
  });
});

describe('judgeLatest', () => {
  it('judges nitrite against the 0.1 mg N/L culture-practice limit (Boyd) and TAN against free ammonia as TAN', () => {
    const judged = judgeLatest({ tanMgN: 2, no2MgN: 0.3, ph: null, temperatureC: null }, { ph: 8, temperatureC: 28 });
    expect(judged[1]).toMatchObject({ key: 'no2MgN', level: 'over', limit: { value: NITRITE_PRACTICE_LIMIT_MG_N } });
    // The tank's pH and temperature stand in for the test's missing ones.
    const limit = limitsAt({ ph: 8, temperatureC: 28 }).freeNh3AsTan.value;
    expect(judged[0].limit.value).toBeCloseTo(limit, 12);
    expect(judged[0].level).toBe(2 > limit ? 'over' : 2 >= limit / 2 ? 'watch' : 'ok');
  });

  it('judges the same TAN more harshly at higher pH (free ammonia rises with pH, Emerson et al. 1975)', () => {
    const low = judgeLatest({ tanMgN: 0.5, no2MgN: null, ph: 6.8, temperatureC: 25 }, { ph: 7, temperatureC: 25 })[0];
    const high = judgeLatest({ tanMgN: 0.5, no2MgN: null, ph: 8.4, temperatureC: 25 }, { ph: 7, temperatureC: 25 })[0];
    expect(high.limit.value).toBeLessThan(low.limit.value);
  });

  it('leaves untested values out', () => {
    expect(judgeLatest({ tanMgN: null, no2MgN: null, ph: 7, temperatureC: 25 }, { ph: 7, temperatureC: 25 })).toEqual([]);
  });
});

describe('nextTestDue', () => {
  it('is today without any test', () => {
    expect(nextTestDue(null, null, NOW)).toEqual({ date: '2026-03-10', reason: 'no-test-yet' });
  });

  it(`is ${ROUTINE_TEST_INTERVAL_DAYS} days after the last test without a plan (common practice)`, () => {
    expect(nextTestDue(new Date('2026-03-08T20:00:00Z'), null, NOW)).toEqual({ date: '2026-03-15', reason: 'routine' });
  });

  it("is the running plan's first check day after the last test (shared/plan-check-days.ts)", () => {
    const events = [{ type: 'add-fish', day: 9, fish: [{ species: 'guppy', count: 3 }] }];
    // Fish added on day 9 = 10 Mar: the plans' rule checks the day after, 11 Mar.
    expect(nextTestDue(new Date('2026-03-10T08:00:00Z'), { startDate: '2026-03-01', events } as never, NOW)).toEqual({
      date: '2026-03-11',
      reason: 'plan-check-day',
      detail: '3 fish added on day 9',
    });
    // A missed check day is overdue: last test 1 Mar, plan adds fish on day 2 → check on 4 Mar.
    const early = { startDate: '2026-03-01', events: [{ ...events[0], day: 2 }] };
    expect(nextTestDue(new Date('2026-03-01T08:00:00Z'), early as never, NOW)).toMatchObject({ date: '2026-03-04', reason: 'plan-check-day' });
    // Once every check day is behind, the routine week applies.
    const past = { startDate: '2026-01-01', events };
    expect(nextTestDue(new Date('2026-03-10T08:00:00Z'), past as never, NOW)).toEqual({ date: '2026-03-17', reason: 'routine' });
  });

  it('says overdue dates as they are (in the past)', () => {
    expect(tankStatus({ ph: 7, temperatureC: 25 }, { takenAt: new Date('2026-02-01T08:00:00Z'), tanMgN: 0, no2MgN: 0, ph: 7, temperatureC: 25 }, null, NOW)).toMatchObject({
      overall: 'ok',
      nextTest: { date: '2026-02-08', reason: 'routine' },
    });
  });

  it('asks for a test the next day after a test over a limit', () => {
    const over = { takenAt: new Date('2026-03-08T08:00:00Z'), tanMgN: 0, no2MgN: 0.5, ph: 7, temperatureC: 25 };
    expect(tankStatus({ ph: 7, temperatureC: 25 }, over, null, NOW)).toMatchObject({ overall: 'over', nextTest: { date: '2026-03-09', reason: 'over-limit' } });
  });
});
