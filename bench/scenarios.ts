/** Invented benchmark scenario: a mature 120 L community tank with 10 events in 60 days. */
import type { ScenarioInput } from '../simulation/scenario';

export const BENCH_SCENARIO: ScenarioInput = {
  name: 'Benchmark: mature 120 L tank, 10 events',
  tank: {
    volumeL: 120,
    temperatureC: 25,
    ph: 7.4,
    khDegrees: 8,
    zones: [
      { id: 'filter', kind: 'filter', media: { type: 'ceramic-rings', volumeL: 1.5 } },
      { id: 'substrate', kind: 'substrate', media: { type: 'gravel', volumeL: 6 } },
      { id: 'surfaces', kind: 'surfaces', areaM2: 1.3 },
    ],
    plants: 'light',
  },
  start: { kind: 'mature' },
  fish: [
    { species: 'neon-tetra', count: 15 },
    { species: 'bronze-corydoras', count: 6 },
  ],
  events: [
    { type: 'add-fish', day: 5, fish: { species: 'platy', count: 8 } },
    { type: 'water-change', day: 7, percent: 25 },
    { type: 'feeding', day: 10, feeding: { mode: 'grams', gramsPerDay: 1.2, proteinShare: 0.42 } },
    { type: 'temperature', day: 14, temperatureC: 26.5 },
    { type: 'ammonia-dose', day: 20, amount: { unit: 'mgN-per-L', value: 0.5 } },
    { type: 'filter-clean', day: 21, zoneId: 'filter', action: 'rinse', shareLost: 0.3 },
    { type: 'medication', day: 25, durationDays: 5, oxidationMultiplier: 0.6 },
    { type: 'water-change', day: 35, percent: 30 },
    { type: 'remove-fish', day: 40, species: 'platy', count: 4 },
    { type: 'aeration-loss', day: 45, durationDays: 1, oxygenShare: 0.5 },
  ],
};
