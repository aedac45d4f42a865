/**
 * One judgement of one forecast: the verdict, the sentences under the chart, the spare
 * capacity and the check days' expectations must all say what the forecast's numbers say.
 * Plans are generated (additions, removals, doses, empty tanks, media replacement) and each
 * text is checked against the numbers it came from.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { forecast } from '@/simulation/forecast';
import { KIT_FIRST_STEP_MG_N } from '@/simulation/forecast/spare-capacity';
import type { ScenarioEvent, ScenarioInput } from '@/simulation/scenario';
import { forecastSentences, forecastVerdict, forecastView, spareCapacitySentence } from '@/shared/forecast-view';
import { planCheckDays } from '@/shared/plan-check-days';
import { levelFor } from '@/shared/tank-status';

const SEED = 20261204;
const tank: ScenarioInput['tank'] = {
  volumeL: 120,
  temperatureC: 25,
  ph: 7.4,
  zones: [
    { id: 'filter', kind: 'filter', media: { type: 'ceramic-rings', volumeL: 1.5 } },
    { id: 'surfaces', kind: 'surfaces', areaM2: 1.5 },
  ],
};
const day = fc.integer({ min: 1, max: 20 });
const eventArb: fc.Arbitrary<ScenarioEvent> = fc.oneof(
  fc.record({ type: fc.constant('add-fish' as const), day, fish: fc.tuple(fc.record({ species: fc.constant('neon-tetra'), count: fc.integer({ min: 1, max: 80 }) })) }),
  fc.record({ type: fc.constant('remove-fish' as const), day, fish: fc.tuple(fc.record({ species: fc.constant('neon-tetra'), count: fc.integer({ min: 1, max: 20 }) })) }),
  fc.record({ type: fc.constant('ammonia-dose' as const), day, amount: fc.record({ unit: fc.constant('mgN-per-L' as const), value: fc.double({ min: 0.1, max: 3, noNaN: true }) }), repeatEveryDays: fc.constant(2), repeatCount: fc.integer({ min: 1, max: 10 }) }),
  fc.record({ type: fc.constant('filter-clean' as const), day, zoneId: fc.constant('filter'), action: fc.constant('replace' as const), shareLost: fc.constant(1) }),
  fc.record({ type: fc.constant('water-change' as const), day, percent: fc.integer({ min: 10, max: 50 }) }),
);
const planArb = fc.record({
  fish: fc.integer({ min: 0, max: 40 }),
  events: fc.array(eventArb, { maxLength: 5 }),
});

describe('one voice: every text of a plan follows its forecast', () => {
  it(`holds over generated plans (fast-check seed ${SEED})`, () => {
    fc.assert(
      fc.property(planArb, ({ fish, events }) => {
        // Removals only of fish that are there.
        const kept = events.filter((e) => e.type !== 'remove-fish' || e.fish[0].count <= fish);
        const s: ScenarioInput = { tank, start: fish > 0 ? { kind: 'mature' } : { kind: 'new' }, fish: fish > 0 ? [{ species: 'neon-tetra', count: fish }] : [], events: kept };
        const f = forecast(s, { horizonDays: 40 });
        const v = forecastView(f);
        const verdict = forecastVerdict(v);
        const over = (['freeNh3', 'tanChronic', 'tanAcute', 'no2'] as const).some((k) => v.daysOver[k].days > 0);
        // The verdict is "over" exactly when a limit is crossed, and "ok" only when no peak is near one.
        expect(verdict.level === 'over').toBe(over);
        if (verdict.level === 'ok') {
          expect(levelFor(v.peaks.tan.value, v.limits.tanChronicMgN)).toBe('ok');
          expect(levelFor(v.peaks.no2.value, v.limits.no2MgN)).toBe('ok');
        }
        // The sentences under the chart say "nothing goes over" exactly when nothing does.
        expect(forecastSentences(v).some((t) => t.startsWith('Nothing goes over'))).toBe(!over);
        // Spare capacity is stated only for a stocked tank whose water does not already show.
        const spare = spareCapacitySentence(v);
        const shows = f.series.tanMgN[0] >= KIT_FIRST_STEP_MG_N.tan || f.series.no2MgN[0] >= KIT_FIRST_STEP_MG_N.no2;
        expect(spare !== null).toBe(fish > 0 && !shows);
        // Check days: what to expect comes from the forecast, never from a fixed phrase.
        for (const c of planCheckDays(kept, '2026-12-01', v)) {
          for (const r of c.reasons) expect(r).not.toMatch(/near zero|should (be|read)/);
          expect(c.expected).toBeDefined();
          const k = v.days.findIndex((d) => d >= c.day - 1e-9);
          const around = [v.tanMgN[Math.max(0, k - 1)], v.tanMgN[k]];
          expect(around).toContain(c.expected!.tanMgN);
        }
      }),
      { seed: SEED, numRuns: 40 },
    );
  });
});
