import { describe, expect, it } from 'vitest';
import { rescueWaterChanges } from '../../../simulation/advice/rescue-water-changes';
import { rescueResponseSchema } from '../../../simulation/advice/schemas';
import { DEVELOPER_WORDS, matureTank, peakRatio, resimulate } from './fixtures';

const scenario = matureTank({ events: [{ type: 'add-fish', day: 2, fish: { species: 'platy', count: 40 } }], horizonDays: 40 });
const withChanges = (cs: { day: number; percent: number }[]) => ({
  ...scenario,
  events: [...scenario.events, ...cs.map((c) => ({ type: 'water-change' as const, day: c.day, percent: c.percent }))],
});

describe('rescueWaterChanges: 40 platies added at once to a 200 L tank (invented scenario)', () => {
  const advice = rescueWaterChanges({ scenario });
  const worst = (cs: { day: number; percent: number }[]) =>
    Math.max(...advice.judgement.boundingDraws.map((m) => peakRatio(resimulate(withChanges(cs), m, 40))));

  it('explains itself without model jargon: the worst 1 in 10 forecasts, not "pessimistic" ones (issue 15)', () => {
    for (const line of advice.explanation) expect(line).not.toMatch(DEVELOPER_WORDS);
    expect(advice.explanation.join(' ')).toMatch(/the worst 1 in 10 forecasts cross/);
  });

  it('proposes water changes because the forecast crosses a limit', () => {
    expect(advice.status).toBe('rescued');
    expect(advice.changes.length).toBeGreaterThan(0);
    expect(worst([])).toBeGreaterThan(1);
  });

  it('keeps the re-simulated forecast under every limit on the draws it was judged on', () => {
    expect(worst(advice.changes)).toBeLessThanOrEqual(1);
  });

  it('is smallest: dropping any one change, or making any one 5 % smaller, crosses a limit', () => {
    advice.changes.forEach((_, i) => {
      expect(worst(advice.changes.filter((_, j) => j !== i))).toBeGreaterThan(1);
      const smaller = advice.changes.map((c, j) => (j === i ? { ...c, percent: c.percent - 5 } : c));
      if (smaller[i].percent >= 10) expect(worst(smaller)).toBeGreaterThan(1);
    });
  });

  it('keeps the band\'s 90th percentile of peaks under the limits and matches the response schema', () => {
    expect(advice.withChanges!.edgePeakRatio).toBeLessThanOrEqual(1);
    expect(rescueResponseSchema.safeParse(advice).success).toBe(true);
    expect(advice.cautions.join(' ')).toMatch(/chloramine/);
  });

  it('needs no changes for a tank left alone', () => {
    expect(rescueWaterChanges({ scenario: matureTank({ horizonDays: 20 }) }).status).toBe('no-changes-needed');
  });
});
