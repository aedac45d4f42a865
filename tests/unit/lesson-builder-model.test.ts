import { describe, expect, it } from 'vitest';
import { createLessonSchema } from '@/shared/schemas/lesson';
import type { ScenarioEvent } from '@/simulation/scenario';
import type { UnitPreferences } from '@/shared/schemas/preferences';
import { forecast } from '@/simulation/forecast';
import {
  addStep,
  buildLessonInput,
  DEFAULT_FAST_NAME,
  DEFAULT_STAGED_NAME,
  emptyLessonForm,
  errorPlaces,
  GUESS_STEP,
  horizonOf,
  lessonFieldFor,
  lessonScenarios,
  mapLessonErrors,
  MAX_LESSON_STEPS,
  moveStep,
  removeStep,
  splitAdditions,
  stagedFromFast,
  type LessonBuilderForm,
} from '@/components/lessons/lesson-builder-model';
import { lessonAuthorClubs } from '@/components/lessons/lesson-authors';

const METRIC: UnitPreferences = { volumeUnit: 'L', temperatureUnit: 'C', nitrogenBasis: 'N' };
const US: UnitPreferences = { volumeUnit: 'USgal', temperatureUnit: 'F', nitrogenBasis: 'ion' };
const CLUB = '6f1c1f8e-8a43-4c55-9d1e-2f9b6f0b7a11';

const add = (day: number, count: number, species = 'cherry-barb'): ScenarioEvent => ({ type: 'add-fish', day, fish: [{ species, count }] });
const wc = (day: number, percent = 25): ScenarioEvent => ({ type: 'water-change', day, percent });

/** A mentor's finished single lesson: the default tank, thirty barbs on day 1, two steps. */
function filledForm(patch: Partial<LessonBuilderForm> = {}): LessonBuilderForm {
  return {
    ...emptyLessonForm(METRIC, CLUB),
    title: 'Thirty barbs at once',
    summary: 'A settled tank gets a big purchase.',
    events: [add(1, 30)],
    steps: [{ title: 'The tank today', body: 'Eight neon tetras in 120 L.' }, { ...GUESS_STEP }],
    ...patch,
  };
}

describe('emptyLessonForm', () => {
  it('starts from a typical settled 120 L tank in the person’s units, with the guess step ready', () => {
    const metric = emptyLessonForm(METRIC);
    expect(metric.tank.volume).toBe('120');
    expect(metric.tank.temperature).toBe('25');
    // 120 L = 31.70 US gal; 25 °C = 77 °F (unit definitions, NIST Handbook 44 appendix C).
    const us = emptyLessonForm(US);
    expect(us.tank.volume).toBe('31.7');
    expect(us.tank.temperature).toBe('77');
    expect(metric.steps.at(-1)).toEqual(GUESS_STEP);
    expect(metric.kind).toBe('single');
  });
});

describe('buildLessonInput', () => {
  it('turns a filled single lesson into a request the shared schema accepts', () => {
    const result = buildLessonInput(filledForm(), METRIC);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.clubId).toBe(CLUB);
    const parsed = createLessonSchema.parse(result.input);
    expect(parsed.kind).toBe('single');
    expect(parsed.stagedScenario).toBeUndefined();
    const s = parsed.scenario!;
    expect(s.tank.volumeL).toBe(120);
    expect(s.tank.temperatureC).toBe(25);
    expect(s.tank.ph).toBe(7.2);
    expect(s.tank.khDegrees).toBeUndefined();
    expect(s.tank.zones.map((z) => z.id)).toEqual(['filter', 'substrate', 'surfaces']);
    expect(s.tank.routineWaterChange).toEqual({ percent: 25, everyDays: 7 });
    expect(s.start).toEqual({ kind: 'mature' });
    expect(s.fish).toEqual([{ species: 'neon-tetra', count: 8 }]);
    expect(s.events).toEqual([add(1, 30)]);
    // Empty horizon: three weeks after the last event, at least 30 days (shared/tank-scenario.ts).
    expect(s.horizonDays).toBe(30);
    expect(parsed.steps).toHaveLength(2);
  });

  it('converts US gallons and °F to litres and °C, and a bare bottom leaves out the substrate zone', () => {
    const form = filledForm();
    const result = buildLessonInput({ ...form, tank: { ...form.tank, volume: '50', temperature: '78.8', substrate: 'bare', kh: '4' } }, US);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const tank = result.input.scenario!.tank;
    // 1 US gal = 3.785411784 L (NIST Handbook 44 appendix C); 78.8 °F = 26 °C.
    expect(tank.volumeL).toBeCloseTo(189.27, 2);
    expect(tank.temperatureC).toBeCloseTo(26, 6);
    expect(tank.khDegrees).toBe(4);
    expect(tank.zones.map((z) => z.id)).toEqual(['filter', 'surfaces']);
  });

  it('sends no routine water change when the mentor types 0 %, even with the days left empty', () => {
    const form = filledForm();
    const result = buildLessonInput({ ...form, tank: { ...form.tank, waterChangePercent: '0', waterChangeEveryDays: '' } }, METRIC);
    expect(result.ok && result.input.scenario!.tank.routineWaterChange).toBeUndefined();
  });

  it('names the empty title, the missing club and an empty step under their own fields', () => {
    const result = buildLessonInput(filledForm({ clubId: '', title: '  ', steps: [{ title: 'Only a title', body: '' }] }), METRIC);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors.title).toBe('Use at least 3 characters.');
    expect(result.errors.clubId).toBe('Choose the club this lesson is for.');
    expect(result.errors['steps.0.body']).toBe('Write the step.');
    expect(result.errors['steps.0.title']).toBeUndefined();
  });

  it('says which tank field is not a number, and which is out of the engine’s range', () => {
    const form = filledForm();
    const bad = buildLessonInput({ ...form, tank: { ...form.tank, volume: 'big', ph: '' } }, METRIC);
    expect(bad.ok).toBe(false);
    if (bad.ok) return;
    expect(bad.errors['tank.volume']).toMatch(/as a number/);
    expect(bad.errors['tank.ph']).toBe('Enter a pH.');
    // Range messages come from the shared scenario schema.
    const hot = buildLessonInput({ ...form, tank: { ...form.tank, temperature: '45' } }, METRIC);
    expect(!hot.ok && hot.errors['tank.temperature']).toBe('Temperature must be 0–40 °C.');
    const none = buildLessonInput({ ...form, tank: { ...form.tank, volume: '0' } }, METRIC);
    expect(!none.ok && none.errors['tank.volume']).toBe('Volume must be above 0 L.');
  });

  it('refuses a starting fish row without a catalogue species or a count', () => {
    const form = filledForm();
    const result = buildLessonInput({ ...form, tank: { ...form.tank, fish: [{ species: 'mermaid', count: '' }] } }, METRIC);
    expect(!result.ok && result.errors['tank.fish.0.species']).toBe('Choose a species from the list.');
    expect(!result.ok && result.errors['tank.fish.0.count']).toBe('Enter how many.');
  });

  it('asks for at least one event, and for the staged timeline of a comparison', () => {
    const result = buildLessonInput(filledForm({ kind: 'compare', events: [] }), METRIC);
    expect(!result.ok && result.errors.events).toMatch(/at least one event/);
    expect(!result.ok && result.errors.stagedEvents).toMatch(/staged timeline/);
  });

  it('puts an event after a typed horizon on the horizon field', () => {
    const result = buildLessonInput(filledForm({ events: [add(1, 30), wc(40)], horizon: '35' }), METRIC);
    expect(!result.ok && result.errors.horizon).toBe('Day 40 is after the forecast horizon (35).');
  });

  it('builds a comparison with both scenarios on the same tank and the default names', () => {
    const result = buildLessonInput(filledForm({ kind: 'compare', stagedEvents: splitAdditions([add(1, 30)], 3, 7) }), METRIC);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const parsed = createLessonSchema.parse(result.input);
    expect(parsed.scenario!.name).toBe(DEFAULT_FAST_NAME);
    expect(parsed.stagedScenario!.name).toBe(DEFAULT_STAGED_NAME);
    expect(parsed.stagedScenario!.tank).toEqual(parsed.scenario!.tank);
    // Both share one horizon so the two charts line up: last staged addition day 15 + 21.
    expect(parsed.scenario!.horizonDays).toBe(36);
    expect(parsed.stagedScenario!.horizonDays).toBe(36);
  });

  it('makes a scenario the engine forecasts: thirty barbs at once raise nitrite above the settled level', () => {
    const built = lessonScenarios(filledForm(), METRIC);
    expect(built.ok).toBe(true);
    if (!built.ok) return;
    const f = forecast(built.scenario);
    const no2 = f.series.no2MgN;
    // A settled tank's nitrite sits near zero before the purchase; the addition lifts it
    // (nitrite lags ammonia after a load increase: common practice; MODEL.md §9.2).
    expect(Math.max(...no2)).toBeGreaterThan(5 * no2[0]);
  });
});

describe('errorPlaces', () => {
  it('names where the messages are, in the order of the form, once each', () => {
    expect(errorPlaces({ 'steps.1.body': 'x', 'tank.ph': 'x', title: 'x', horizon: 'x', 'tank.volume': 'x', 'steps.0.title': 'x' })).toEqual([
      'Title',
      'The tank',
      'What happens when',
      'Step 1',
      'Step 2',
    ]);
    expect(errorPlaces({})).toEqual([]);
  });
});

describe('server field errors', () => {
  it('map each request path back to the form field that shows it', () => {
    expect(lessonFieldFor('title')).toBe('title');
    expect(lessonFieldFor('steps.3.body')).toBe('steps.3.body');
    expect(lessonFieldFor('scenario.tank.volumeL')).toBe('tank.volume');
    expect(lessonFieldFor('stagedScenario.tank.temperatureC')).toBe('tank.temperature');
    expect(lessonFieldFor('scenario.fish.1.count')).toBe('tank.fish.1.count');
    expect(lessonFieldFor('scenario.horizonDays')).toBe('horizon');
    expect(lessonFieldFor('stagedScenario.events.2.fish.count')).toBe('stagedEvents');
    expect(lessonFieldFor('fromShareId')).toBeNull();
    const mapped = mapLessonErrors({ title: 'Use at most 120 characters.', fromShareId: 'Not both.', 'scenario.tank.ph': 'pH must be between 4 and 10.' });
    expect(mapped.fields).toEqual({ title: 'Use at most 120 characters.', 'tank.ph': 'pH must be between 4 and 10.' });
    expect(mapped.other).toEqual(['Not both.']);
  });
});

describe('steps', () => {
  const steps = [
    { title: 'a', body: '1' },
    { title: 'b', body: '2' },
    { title: 'c', body: '3' },
  ];
  it('move up and down, and ignore moves past either end', () => {
    expect(moveStep(steps, 2, -1).map((s) => s.title)).toEqual(['a', 'c', 'b']);
    expect(moveStep(steps, 0, 1).map((s) => s.title)).toEqual(['b', 'a', 'c']);
    expect(moveStep(steps, 0, -1)).toEqual(steps);
    expect(moveStep(steps, 2, 1)).toEqual(steps);
  });
  it('are added empty up to twelve, and removed by position', () => {
    expect(addStep(steps).at(-1)).toEqual({ title: '', body: '' });
    const full = Array.from({ length: MAX_LESSON_STEPS }, () => ({ title: 't', body: 'b' }));
    expect(addStep(full)).toHaveLength(MAX_LESSON_STEPS);
    expect(removeStep(steps, 1).map((s) => s.title)).toEqual(['a', 'c']);
  });
});

describe('splitAdditions', () => {
  it('splits each addition into batches a set number of days apart, larger batches first, other events kept', () => {
    const staged = splitAdditions([add(1, 31), wc(7)], 3, 7);
    expect(staged.map((e) => [e.day, e.type === 'add-fish' ? e.fish[0]!.count : 'wc'])).toEqual([
      [1, 11],
      [7, 'wc'],
      [8, 10],
      [15, 10],
    ]);
  });
  it('never makes empty batches, and leaves the fast timeline untouched', () => {
    const fast = [add(0, 2)];
    const staged = splitAdditions(fast, 5, 3);
    expect(staged.map((e) => (e.type === 'add-fish' ? e.fish[0]!.count : 0))).toEqual([1, 1]);
    expect(fast[0]).toEqual(add(0, 2));
  });
});

describe('stagedFromFast', () => {
  it('checks the typed batches and days before splitting', () => {
    expect(stagedFromFast([add(1, 30)], '3', '7')).toEqual({ events: splitAdditions([add(1, 30)], 3, 7) });
    expect(stagedFromFast([add(1, 30)], '1', '7')).toEqual({ error: 'Batches: a whole number from 2 to 10.' });
    expect(stagedFromFast([add(1, 30)], '2.5', '7')).toEqual({ error: 'Batches: a whole number from 2 to 10.' });
    expect(stagedFromFast([add(1, 30)], '3', '0.5')).toEqual({ error: 'Days apart: from 1 to 60.' });
    expect(stagedFromFast([wc(3)], '3', '7')).toEqual({ error: 'The fast timeline has no fish addition to split.' });
  });
});

describe('horizonOf', () => {
  it('uses the typed days, or three weeks after the last event of either timeline', () => {
    expect(horizonOf({ horizon: '50', events: [], stagedEvents: [], kind: 'single' })).toBe(50);
    expect(horizonOf({ horizon: 'soon', events: [], stagedEvents: [], kind: 'single' })).toBeNull();
    expect(horizonOf({ horizon: '', events: [add(20, 5)], stagedEvents: [add(40, 5)], kind: 'compare' })).toBe(61);
    expect(horizonOf({ horizon: '', events: [add(20, 5)], stagedEvents: [add(40, 5)], kind: 'single' })).toBe(41);
  });
});

describe('lessonAuthorClubs', () => {
  it('keeps the clubs where the person is mentor or organizer', () => {
    const clubs = [
      { id: 'a', myRole: 'member' as const },
      { id: 'b', myRole: 'mentor' as const },
      { id: 'c', myRole: 'organizer' as const },
    ];
    expect(lessonAuthorClubs(clubs).map((c) => c.id)).toEqual(['b', 'c']);
    expect(lessonAuthorClubs([clubs[0]])).toEqual([]);
  });
});
