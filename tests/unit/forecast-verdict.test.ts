import { describe, expect, it } from 'vitest';
import { forecastSentences, forecastVerdict, limitCrossings } from '@/shared/forecast-view';
import { acuteAmmoniaLine, forecastLimitRows, LIMIT_BASIS, overText } from '@/lib/forecast-limits';
import { fixtureView } from './forecast-fixture';

describe('forecastVerdict: one sentence from the forecast judgement', () => {
  it('says the forecast stays well under the limits when every peak is below half its limit', () => {
    const v = fixtureView({ tanPeak: 0.2, no2Peak: 0.02 });
    expect(limitCrossings(v)).toEqual([]);
    expect(forecastVerdict(v)).toEqual({ level: 'ok', sentence: 'Stays well under every limit in this forecast.' });
  });

  it('warns when a peak comes within the share of its limit a water test is flagged at', () => {
    const v = fixtureView({ no2Peak: 0.07 });
    const verdict = forecastVerdict(v);
    expect(verdict.level).toBe('watch');
    expect(verdict.sentence).toBe('Stays under every limit, but nitrite comes close around day 16: test on the check days.');
  });

  it('names what goes over, from which day and for how long, in the same terms as the explanation', () => {
    const v = fixtureView({ no2Peak: 0.4, no2Over: { days: 6, firstDay: 13 } });
    expect(forecastVerdict(v)).toEqual({ level: 'over', sentence: 'Nitrite would go over its limit from day 13, for 6 days: too much for the fish as planned.' });
    expect(forecastSentences(v)).toContain('Nitrite is over its limit (0.1 mg N/L) for 6 days, from day 13.');
  });

  it('joins several crossings into one sentence with the earliest day and the longest stretch', () => {
    const v = fixtureView({ tanPeak: 2, no2Peak: 0.4, tanOver: { days: 3, firstDay: 9 }, no2Over: { days: 6, firstDay: 13 } });
    expect(forecastVerdict(v).sentence).toBe('Total ammonia and nitrite would go over their limits from day 9, for up to 6 days: too much for the fish as planned.');
  });
});

describe('forecastLimitRows', () => {
  it('gives each value its peak and limit in the keeper basis, with the limit basis in words', () => {
    const rows = forecastLimitRows(fixtureView({ no2Peak: 0.05 }), 'ion');
    const no2 = rows.find((r) => r.key === 'no2')!;
    expect(no2.peak).toBe('0.16 mg/L NO2−'); // 0.05 mg N/L × 46.01/14.007 [pub] molar masses
    expect(no2.limit?.value).toBe('0.33 mg/L NO2−');
    expect(no2.limit?.basis).toBe(LIMIT_BASIS.no2);
    expect(rows.find((r) => r.key === 'no3')!.limit).toBeNull();
    expect(overText(rows.find((r) => r.key === 'tan')!.limit!)).toBe('Stays under the limit (1.5 mg/L NH4+)');
  });

  it('adds the short-term ammonia line only when the forecast goes over it', () => {
    expect(acuteAmmoniaLine(fixtureView(), 'N')).toBeNull();
    const v = fixtureView();
    v.daysOver.tanAcute = { days: 2, firstDay: 4 };
    expect(acuteAmmoniaLine(v, 'N')).toBe('Total ammonia is over the short-term limit (11 mg/L as N) for 2 days, from day 4.');
  });
});
