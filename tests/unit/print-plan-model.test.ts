import { describe, expect, it } from 'vitest';
import { planCheckDays } from '@/shared/plan-check-days';
import { ESTIMATE_CAUTIONS, REHOMING_CAUTIONS } from '@/simulation/advice/cautions';
import type { ScenarioEvent } from '@/simulation/scenario';
import type { TankDetail } from '@/shared/schemas/tank';
import { DEFAULT_PREFERENCES } from '@/shared/schemas/preferences';
import { fishLists, IF_HIGH, keepInMind, printDays, printLimits, readingColumns, tankFacts } from '@/components/plans/print-plan-model';
import { LIMIT_BASIS } from '@/lib/forecast-limits';
import { fixtureView } from './forecast-fixture';

const events: ScenarioEvent[] = [
  { type: 'add-fish', day: 0, fish: [{ species: 'neon-tetra', count: 6, lengthCm: 3 }] },
  { type: 'add-fish', day: 21, fish: [{ species: 'neon-tetra', count: 6, lengthCm: 3 }] },
  { type: 'water-change', day: 28, percent: 25 },
  { type: 'remove-fish', day: 30, fish: [{ species: 'neon-tetra', count: 2 }] },
];
const plan = { startDate: '2026-03-01', events, checkDays: planCheckDays(events, '2026-03-01') };

const tank: Pick<TankDetail, 'volumeL' | 'temperatureC' | 'ph' | 'khDkh' | 'setup' | 'livestock'> = {
  volumeL: 120,
  temperatureC: 25,
  ph: 7.4,
  khDkh: 4,
  setup: { filter: { kind: 'canister', mediaVolumeL: 2 } },
  livestock: [
    { id: '00000000-0000-4000-8000-000000000001', speciesId: 'neon-tetra', customName: null, count: 8, lengthCm: null },
    { id: '00000000-0000-4000-8000-000000000002', speciesId: null, customName: 'Amano shrimp', count: 3, lengthCm: 3 },
  ],
};

describe('printDays', () => {
  it('has a row for every event day and check day, in order, through the last check day', () => {
    const rows = printDays(plan);
    const lastCheck = plan.checkDays[plan.checkDays.length - 1];
    expect(rows.map((r) => r.day)).toEqual([...rows.map((r) => r.day)].sort((a, b) => a - b));
    expect(rows[rows.length - 1].day).toBe(lastCheck.day);
    expect(lastCheck.day).toBeGreaterThan(35); // the old printout was cut after day 35
    expect(rows[rows.length - 1].tests[0]).toMatch(/^Test total ammonia and nitrite: /);
    expect(rows.find((r) => r.day === 21)!.todo).toEqual(['Add 6 Neon tetra']);
    expect(rows.find((r) => r.day === 21)!.date).toBe('2026-03-22');
  });
});

describe('printDays with doses', () => {
  it('says how each dose goes in: split into parts, or continuously by pump or drip', () => {
    const doses: ScenarioEvent[] = [
      { type: 'ammonia-dose', day: 1, amount: { unit: 'mgN-per-L', value: 0.4 }, timesPerDay: 4, repeatEveryDays: 1, repeatCount: 5 },
      { type: 'ammonia-dose', day: 8, amount: { unit: 'mgN-per-L', value: 0.4 }, delivery: 'continuous', repeatEveryDays: 1, repeatCount: 5 },
    ];
    const rows = printDays({ startDate: '2026-03-01', events: doses, checkDays: planCheckDays(doses, '2026-03-01') });
    expect(rows.find((r) => r.day === 1)!.todo).toEqual(['Dose ammonia 0.4 mg N/L in 4 equal doses 6 h apart, every day, 5 times']);
    expect(rows.find((r) => r.day === 8)!.todo).toEqual(['Dose ammonia 0.4 mg N/L a day for 5 days, continuously (dosing pump or drip)']);
    expect(rows.find((r) => r.day === 9)!.tests[0]).toMatch(/a day into the continuous ammonia dose/);
  });
});

describe('tankFacts', () => {
  it('gives volume, temperature, pH, hardness and filter in litres and °C by default', () => {
    expect(tankFacts(tank, DEFAULT_PREFERENCES)).toEqual([
      { label: 'Volume', value: '120 L' },
      { label: 'Temperature', value: '25 °C' },
      { label: 'pH', value: '7.4' },
      { label: 'Carbonate hardness', value: '4 dKH' },
      { label: 'Filter', value: 'Canister filter, 2 L of media' },
    ]);
  });

  it('follows the keeper units: US gallons and °F', () => {
    const facts = tankFacts({ ...tank, khDkh: null, setup: {} }, { ...DEFAULT_PREFERENCES, volumeUnit: 'USgal', temperatureUnit: 'F' });
    expect(facts).toEqual([
      { label: 'Volume', value: '31.7 US gal' }, // 120 L / 3.785 L per US gal [pub] NIST
      { label: 'Temperature', value: '77 °F' },
      { label: 'pH', value: '7.4' },
      { label: 'Filter', value: 'Not described' },
    ]);
  });
});

describe('fishLists', () => {
  it('lists the fish in the tank, and sums what the plan adds and takes out per kind', () => {
    expect(fishLists(tank, plan)).toEqual({ now: ['8 Neon tetra', '3 Amano shrimp'], added: ['12 Neon tetra'], leaving: ['2 Neon tetra'] });
  });
});

describe('printLimits and readingColumns', () => {
  it('gives every limit its value in the keeper basis and its basis, with both ammonia limits', () => {
    const limits = printLimits(fixtureView(), 'ion');
    expect(limits.map((l) => l.name)).toEqual(['Total ammonia, long-term', 'Total ammonia, short-term', 'Free ammonia', 'Nitrite']);
    expect(limits[3]).toEqual({ name: 'Nitrite', value: '0.33 mg/L NO2−', basis: LIMIT_BASIS.no2 });
    expect(limits[1].basis).toBe(LIMIT_BASIS.tanAcute);
  });

  it('heads the reading columns in the keeper basis', () => {
    expect(readingColumns('N').map((c) => `${c.title} ${c.unit}`)).toEqual(['Ammonia mg/L as N', 'Nitrite mg/L as N', 'Nitrate mg/L as N']);
    expect(readingColumns('ion').map((c) => c.unit)).toEqual(['mg/L NH4+', 'mg/L NO2−', 'mg/L NO3−']);
  });
});

describe('keepInMind', () => {
  it('says each caution once and leaves out the ones the high-reading steps already say', () => {
    const out = keepInMind([...ESTIMATE_CAUTIONS, ...REHOMING_CAUTIONS, ...REHOMING_CAUTIONS]);
    expect(out).toEqual([ESTIMATE_CAUTIONS[0], REHOMING_CAUTIONS[0]]);
    expect(IF_HIGH.join(' ')).toMatch(/25–50 %/);
    expect(IF_HIGH.join(' ')).toMatch(/qualified aquatic veterinarian/);
  });
});
