/** The spare-capacity sentence under a verdict: its range always holds the forecast's own figure. */
import { describe, expect, it } from 'vitest';
import { forecast, spareSentence } from '@/simulation/forecast';
import { bandOf } from '@/simulation/advice/ensemble';
import { forecastView, spareCapacitySentence } from '@/shared/forecast-view';

const settled = forecast(
  {
    tank: { volumeL: 120, temperatureC: 25, ph: 7.4, zones: [{ id: 'filter', kind: 'filter', media: { type: 'ceramic-rings', volumeL: 1.5 } }, { id: 'surfaces', kind: 'surfaces', areaM2: 1.5 }] },
    start: { kind: 'mature' },
    fish: [{ species: 'neon-tetra', count: 30 }],
  },
  { horizonDays: 10 },
);

describe('spare capacity in words', () => {
  it('states the figure, and a range that holds it, never below 1× (no room)', () => {
    const own = settled.summary.spareCapacity!.times;
    const band = { ...bandOf([settled]), spareTimes: { p10: 0.3, p50: 0.6, p90: 0.9 } };
    const v = forecastView(settled, band, 64);
    expect(v.spareCapacity!.low).toBe(1);
    expect(v.spareCapacity!.high).toBeCloseTo(Number(own.toPrecision(4)), 6);
    const words = spareCapacitySentence(v)!;
    expect(words).toMatch(/today's fish at once/);
    expect(words).not.toMatch(/0\.\d×/);
  });

  it('says there is no room when the filter cannot take more than today', () => {
    expect(spareSentence({ times: 0.8, showsFirst: 'nitrite' })).toMatch(/almost no room to spare: any addition would show as nitrite/);
  });
});
