import { describe, expect, it } from 'vitest';
import { emptyTankForm, formToTankInput, mapTankErrors, tankToForm } from '@/components/tanks/tank-form-model';
import { lastValues, parseLocalStamp, quickTestInput, EMPTY_QUICK_TEST } from '@/components/readings/quick-test-model';
import { searchCatalogue } from '@/components/tanks/catalogue-search';
import { nextTestLabel } from '@/components/tanks/tank-labels';
import { CATALOGUE } from '@/simulation/catalogue';
import { DEFAULT_PREFERENCES } from '@/shared/schemas/preferences';
import type { TankDetail } from '@/shared/schemas/tank';

const US = { volumeUnit: 'USgal', temperatureUnit: 'F', nitrogenBasis: 'ion' } as const;

describe('tank form', () => {
  it('needs only a name and a volume; the rest takes the defaults', () => {
    const r = formToTankInput({ ...emptyTankForm(), name: 'Quarantine', volume: '60' }, DEFAULT_PREFERENCES, 'create');
    expect(r.ok && r.input).toMatchObject({ name: 'Quarantine', volumeL: 60, setup: { filter: { kind: 'hang-on-back', mediaVolumeL: 0.6 } } });
    expect(r.ok && 'temperatureC' in r.input).toBe(false);
  });

  it('reads typed US gallons, °F and ion values into litres, °C and mg N/L', () => {
    const r = formToTankInput({ ...emptyTankForm(), name: 'Big', volume: '29', temperature: '77', tapTan: '1' }, US, 'create');
    if (!r.ok) throw new Error('expected ok');
    expect(r.input.volumeL).toBeCloseTo(29 * 3.785411784, 9); // NIST Handbook 44
    expect(r.input.temperatureC).toBeCloseTo(25, 12);
    expect(r.input.tapWater!.tanMgN).toBeCloseTo(0.7765, 4); // NH4+ → N (MODEL.md §4.6)
  });

  it('puts messages on the fields: not a number, missing, out of range', () => {
    const r = formToTankInput({ ...emptyTankForm(), name: '', volume: 'ten' }, DEFAULT_PREFERENCES, 'create');
    expect(r.ok).toBe(false);
    expect(!r.ok && r.fields.volume).toMatch(/number/);
    const r2 = formToTankInput({ ...emptyTankForm(), name: '', volume: '10', ph: '12' }, DEFAULT_PREFERENCES, 'create');
    expect(!r2.ok && Object.keys(r2.fields).sort()).toEqual(['name', 'ph']);
    expect(mapTankErrors({ 'setup.filter.mediaVolumeL': 'too small', ownerId: 'no' })).toEqual({ fields: { mediaVolume: 'too small' }, other: ['no'] });
  });

  it('fills the edit form in the person units and saves the same tank back', () => {
    const tank: TankDetail = {
      id: '00000000-0000-4000-8000-000000000001',
      name: 'Planted',
      volumeL: 113.56235352,
      temperatureC: 26,
      ph: 7,
      khDkh: 4,
      tapWater: { tanMgN: 0.3883, no2MgN: 0, no3MgN: 2 },
      setup: { filter: { kind: 'canister', mediaVolumeL: 2 }, substrate: { grain: 'sand', depthCm: 4 }, hardscape: 'lots', plants: 'heavy', lightHoursPerDay: 9 },
      notes: '',
      history: null,
      fit: null,
      livestock: [],
      readings: [],
      plans: [],
    };
    const form = tankToForm(tank, US);
    expect(form).toMatchObject({ volume: '30', temperature: '78.8', tapTan: '0.5', substrate: 'sand', substrateDepthCm: '4', plants: 'heavy' });
    // Without the original, the rounded text drifts (0.53 US gal = 2.006 L); with it, untouched values stay exact.
    const drift = formToTankInput(form, US, 'edit');
    expect(drift.ok && drift.input.setup!.filter!.mediaVolumeL).not.toBe(2);
    const r = formToTankInput(form, US, 'edit', tank);
    if (!r.ok) throw new Error('expected ok');
    expect(r.input.volumeL).toBe(tank.volumeL);
    expect(r.input.tapWater).toEqual(tank.tapWater);
    expect(r.input.temperatureC).toBe(26);
    expect(r.input.setup).toMatchObject({ substrate: { grain: 'sand', depthCm: 4 }, hardscape: 'lots', lightHoursPerDay: 9 });
    expect(r.input.setup!.filter!.mediaVolumeL).toBe(2);
    // A field the person changes is read from what they typed.
    const changed = formToTankInput({ ...form, volume: '40' }, US, 'edit', tank);
    expect(changed.ok && changed.input.volumeL).toBeCloseTo(40 * 3.785411784, 9);
  });
});

describe('quick test', () => {
  const now = new Date('2026-03-10T15:00:00Z');

  it('sends nitrogen in the kit basis and temperature converted to °C', () => {
    const r = quickTestInput({ ...EMPTY_QUICK_TEST, tan: '0,5', no3: '40', temperature: '77' }, 'ion', 'F', now);
    expect(r.ok && r.input).toMatchObject({ basis: 'ion', tan: 0.5, no2: null, no3: 40, takenAt: now.toISOString() });
    expect(r.ok && r.input.temperatureC).toBeCloseTo(25, 12);
  });

  it('names the field of a bad value and refuses an empty test', () => {
    const r = quickTestInput({ ...EMPTY_QUICK_TEST, no2: 'pink' }, 'N', 'C', now);
    expect(!r.ok && r.fields.no2).toBeTruthy();
    const empty = quickTestInput(EMPTY_QUICK_TEST, 'N', 'C', now);
    expect(!empty.ok && empty.fields.tan).toMatch(/at least one/);
    const hot = quickTestInput({ ...EMPTY_QUICK_TEST, temperature: '120' }, 'N', 'F', now);
    expect(!hot.ok && hot.fields.temperature).toBe('Temperature must be 32–113 °F.');
    const when = quickTestInput({ ...EMPTY_QUICK_TEST, tan: '0', when: '31/12/2025' }, 'N', 'C', now);
    expect(!when.ok && when.fields.when).toBeTruthy();
  });

  it('reads local date stamps and rejects impossible dates', () => {
    expect(parseLocalStamp('2026-03-01 08:30', now)).toBe(new Date(2026, 2, 1, 8, 30).toISOString());
    expect(parseLocalStamp('2026-02-30 08:30', now)).toBeNull();
  });

  it('offers the last test in the chosen basis', () => {
    const last = { id: 'x', takenAt: '', tanMgN: 0.7765, no2MgN: null, no3MgN: 2.259, ph: 7.2, temperatureC: 25, khDkh: null, basis: 'N' as const };
    expect(lastValues(last, 'ion', 'F')).toEqual({ tan: '1', no2: '', no3: '10', ph: '7.2', temperature: '77', kh: '' });
  });
});

describe('catalogue search', () => {
  it('finds by common or scientific name, whole words in any order, prefix matches first', () => {
    expect(searchCatalogue(CATALOGUE, 'neon')[0].id).toBe('neon-tetra');
    expect(searchCatalogue(CATALOGUE, 'danio rerio').map((e) => e.id)).toEqual(['zebra-danio']);
    expect(searchCatalogue(CATALOGUE, '')).toHaveLength(CATALOGUE.length);
    expect(searchCatalogue(CATALOGUE, 'no such fish')).toEqual([]);
  });
});

describe('next test label', () => {
  const now = new Date('2026-03-10T15:00:00Z');
  it('says today, overdue or the date, with the reason', () => {
    expect(nextTestLabel({ date: '2026-03-10', reason: 'no-test-yet' }, now, 'en-GB')).toEqual({ text: 'Next test: today (no test logged yet)', overdue: false });
    expect(nextTestLabel({ date: '2026-03-08', reason: 'routine' }, now, 'en-GB')).toEqual({ text: 'Next test: overdue since 8 Mar (a week after the last test)', overdue: true });
    expect(nextTestLabel({ date: '2026-03-12', reason: 'plan-check-day', detail: '6 fish added on day 3' }, now, 'en-GB').text).toBe(
      'Next test: 12 Mar (plan check day: 6 fish added on day 3)',
    );
  });
});
