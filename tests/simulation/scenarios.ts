import type { ScenarioInput } from '@/simulation/scenario';

type Tank = ScenarioInput['tank'];

/** An invented 100 L tank with a filter and lit surfaces; overrides merge in. */
export function tank(overrides: Partial<Tank> = {}): Tank {
  return {
    volumeL: 100,
    temperatureC: 25,
    ph: 7.6,
    zones: [
      { id: 'filter', kind: 'filter', media: { type: 'ceramic-rings', volumeL: 1 } },
      { id: 'surfaces', kind: 'surfaces', areaM2: 1.2 },
    ],
    ...overrides,
  };
}

/** New, unseeded tank dosed `mgN` mg N/L every day (the fishless start-up of MODEL.md §9.2). */
export function startUp(overrides: Partial<Tank> = {}, mgN = 1): ScenarioInput {
  return {
    tank: tank(overrides),
    start: { kind: 'new' },
    events: [{ type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: mgN }, repeatEveryDays: 1 }],
  };
}

/** Mature tank holding `count` platies fed 2 % body mass a day. */
export function matureWithPlaties(count: number, events: ScenarioInput['events'] = [], overrides: Partial<Tank> = {}): ScenarioInput {
  return {
    tank: tank(overrides),
    start: { kind: 'mature' },
    fish: [{ species: 'platy', count }],
    events,
  };
}
