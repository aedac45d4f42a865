import { describe, expect, it } from 'vitest';
import { CATALOGUE, findSpecies } from '@/simulation/catalogue';
import { forecast } from '@/simulation/forecast';
import { PARAMETERS, PARAMETER_KEYS, resolveParameters } from '@/simulation/parameters';
import { FILTER_KINDS, MEDIA_PRESETS, resolveZone, zonesFromDescription } from '@/simulation/presets';
import { scenarioSchema } from '@/simulation/scenario';

describe('zone presets (approximate, from memory)', () => {
  const bare = zonesFromDescription({ volumeL: 120, filter: { kind: 'sponge', mediaVolumeL: 0.5 }, substrate: 'bare', hardscape: 'none' });
  const rich = zonesFromDescription({
    volumeL: 120,
    filter: { kind: 'sponge', mediaVolumeL: 0.5 },
    substrate: { grain: 'gravel', depthCm: 8 },
    hardscape: 'lots',
  });
  const area = (zs: typeof bare.zones) => zs.reduce((s, z) => s + resolveZone(z).areaM2, 0);

  it('makes a bare-bottom tank and a tank rich in rock, wood and deep substrate different', () => {
    expect(bare.zones.map((z) => z.id)).toEqual(['filter', 'surfaces']);
    expect(rich.zones.map((z) => z.id)).toEqual(['filter', 'substrate', 'surfaces']);
    expect(area(rich.zones)).toBeGreaterThan(2 * area(bare.zones));
  });

  it('gives a richer tank a faster start-up at the same filter', () => {
    // Fishless start-up dosed 1 mg N/L a day: nitrite falls back below 0.2 mg N/L sooner where
    // there is more surface to colonise (common practice). Early on the rich tank's inoculum is
    // spread over more, poorer surfaces, so the comparison is the end of the start-up, not day 12.
    const run = (zones: typeof bare.zones) =>
      forecast({ tank: { volumeL: 120, temperatureC: 25, ph: 7.6, zones }, start: { kind: 'new' }, events: [{ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 1 }, repeatEveryDays: 1 }] }, { horizonDays: 60 });
    const clearedDay = (zones: typeof bare.zones) => {
      const { days, no2MgN } = run(zones).series;
      const peak = no2MgN.indexOf(Math.max(...no2MgN));
      const k = no2MgN.findIndex((v, i) => i > peak && v < 0.2);
      return k < 0 ? Infinity : days[k];
    };
    expect(clearedDay(rich.zones)).toBeLessThan(clearedDay(bare.zones));
  });

  it('covers every filter kind, lets a surface skimmer lift aeration, and keeps factors in (0, 1]', () => {
    for (const kind of FILTER_KINDS) {
      const plain = zonesFromDescription({ volumeL: 60, filter: { kind, mediaVolumeL: 1 }, substrate: 'bare', hardscape: 'some' });
      const skim = zonesFromDescription({ volumeL: 60, filter: { kind, mediaVolumeL: 1, surfaceSkimmer: true }, substrate: 'bare', hardscape: 'some' });
      expect(scenarioSchema.shape.tank.safeParse({ volumeL: 60, temperatureC: 25, ph: 7, zones: plain.zones }).success).toBe(true);
      expect(['gentle', 'surface-agitation', 'air-stone', 'strong']).toContain(plain.aeration);
      expect(skim.aeration === plain.aeration ? plain.aeration === 'strong' : true).toBe(true);
    }
    for (const m of Object.values(MEDIA_PRESETS)) {
      expect(m.areaPerLitre).toBeGreaterThan(0);
      expect(m.flow).toBeLessThanOrEqual(1);
    }
  });

  it('lets the keeper override a preset factor', () => {
    expect(resolveZone({ id: 'f', kind: 'filter', media: { type: 'ceramic-rings', volumeL: 2 }, flow: 0.4 }).flow).toBe(0.4);
    expect(resolveZone({ id: 'f', kind: 'filter', media: { type: 'ceramic-rings', volumeL: 2 } }).areaM2).toBeCloseTo(2 * MEDIA_PRESETS['ceramic-rings'].areaPerLitre, 12);
  });
});

describe('catalogue', () => {
  it('holds about 40 fish plus shrimp and snails, all marked approximate', () => {
    const fish = CATALOGUE.filter((e) => !e.invertebrate);
    expect(fish.length).toBeGreaterThanOrEqual(38);
    expect(CATALOGUE.some((e) => e.shape === 'shrimp')).toBe(true);
    expect(CATALOGUE.some((e) => e.shape === 'snail')).toBe(true);
    expect(new Set(CATALOGUE.map((e) => e.id)).size).toBe(CATALOGUE.length);
    expect(CATALOGUE.every((e) => e.approximate && e.adultLengthCm > 0)).toBe(true);
    expect(findSpecies('neon-tetra')?.scientificName).toBe('Paracheirodon innesi');
  });
});

describe('parameter table', () => {
  it('gives every parameter a unit, a default inside its range, a source and a tag', () => {
    for (const key of PARAMETER_KEYS) {
      const p = PARAMETERS[key];
      expect(p.min).toBeLessThanOrEqual(p.default);
      expect(p.default).toBeLessThanOrEqual(p.max);
      expect(p.unit.length).toBeGreaterThan(0);
      expect(p.source.length).toBeGreaterThan(5);
      expect(['pub', 'practice', 'memory', 'judgement']).toContain(p.tag);
    }
  });

  it('merges overrides cheaply and leaves the defaults alone', () => {
    const p = resolveParameters({ muMaxAo: 0.5 });
    expect(p.muMaxAo).toBe(0.5);
    expect(resolveParameters().muMaxAo).toBe(0.9);
  });
});
