import type { ForecastView } from '@/shared/schemas/plan';

/**
 * A small hand-made forecast view: 41 days, total ammonia rising to `tanPeak` on day 10 and
 * nitrite to `no2Peak` on day 16 (mg N/L), limits as a pH 7.5, 25 °C tank gets them.
 */
export function fixtureView(o: { tanPeak?: number; no2Peak?: number; no2Over?: { days: number; firstDay: number | null }; tanOver?: { days: number; firstDay: number | null } } = {}): ForecastView {
  const days = Array.from({ length: 41 }, (_, i) => i);
  const hump = (peak: number, at: number) => days.map((d) => peak * Math.exp(-(((d - at) / 4) ** 2)));
  const tanPeak = o.tanPeak ?? 0.3;
  const no2Peak = o.no2Peak ?? 0.03;
  const tan = hump(tanPeak, 10);
  const no2 = hump(no2Peak, 16);
  const none = { days: 0, firstDay: null };
  return {
    days,
    tanMgN: tan,
    freeNh3MgL: tan.map((x) => x * 0.015),
    no2MgN: no2,
    no3MgN: days.map((d) => d * 0.2),
    aoMgNPerDay: days.map(() => 40),
    noMgNPerDay: days.map(() => 40),
    loadMgNPerDay: days.map(() => 20),
    limits: { freeNh3MgNH3: 0.019, tanChronicMgN: 1.2, tanAcuteMgN: 11, no2MgN: 0.1 },
    peaks: { tan: { value: tanPeak, day: 10 }, freeNh3: { value: tanPeak * 0.015, day: 10 }, no2: { value: no2Peak, day: 16 }, no3: { value: 8, day: 40 } },
    daysOver: { freeNh3: none, tanChronic: o.tanOver ?? none, tanAcute: none, no2: o.no2Over ?? none },
    band: null,
    spareCapacity: null,
  };
}
