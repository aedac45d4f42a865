import type { LessonKind, LessonStep } from '../shared/schemas/lesson.js';
import type { ScenarioInput } from '../simulation/scenario.js';

/**
 * Starter lessons of the demo club: invented scenarios that show why spikes happen. Plain
 * data, so tests and the seed share them. In a comparison the first scenario is the fast one.
 */
export interface DemoLesson {
  key: string;
  title: string;
  summary: string;
  kind: LessonKind;
  scenario: ScenarioInput;
  stagedScenario?: ScenarioInput;
  steps: LessonStep[];
}

const matureTank = (volumeL: number, mediaL: number, areaM2: number): ScenarioInput['tank'] => ({
  volumeL,
  temperatureC: 25,
  ph: 7.2,
  khDegrees: 5,
  zones: [
    { id: 'filter', kind: 'filter', media: { type: 'sponge-coarse', volumeL: mediaL } },
    { id: 'surfaces', kind: 'surfaces', areaM2 },
  ],
});

const weeklyChanges = (days: number[], percent = 25) => days.map((day) => ({ type: 'water-change' as const, day, percent }));

export const DEMO_LESSONS: readonly DemoLesson[] = [
  {
    key: 'big-purchase',
    title: 'The big purchase: thirty barbs at once or in stages',
    summary: 'A settled 100 L tank with six small tetras is about to get thirty cherry barbs. Where does nitrite peak?',
    kind: 'compare',
    scenario: {
      name: 'All thirty on day 1',
      horizonDays: 35,
      tank: matureTank(100, 3, 2),
      start: { kind: 'mature' },
      fish: [{ species: 'neon-tetra', count: 6 }],
      events: [{ type: 'add-fish', day: 1, fish: { species: 'cherry-barb', count: 30 } }, ...weeklyChanges([7, 14, 21, 28])],
    },
    stagedScenario: {
      name: 'Ten a week for three weeks',
      horizonDays: 35,
      tank: matureTank(100, 3, 2),
      start: { kind: 'mature' },
      fish: [{ species: 'neon-tetra', count: 6 }],
      events: [
        ...[1, 8, 15].map((day) => ({ type: 'add-fish' as const, day, fish: { species: 'cherry-barb', count: 10 } })),
        ...weeklyChanges([7, 14, 21, 28]),
      ],
    },
    steps: [
      { title: 'The tank today', body: 'Six neon tetras in 100 L. The biofilter has grown to the waste six small fish make, and no more.' },
      { title: 'The purchase', body: 'Thirty cherry barbs arrive. The waste grows several times over in a day; the filter bacteria that clear ammonia need days to multiply, and the ones that clear nitrite lag behind them.' },
      { title: 'Your guess', body: 'Drag the marker to the day and height where you think nitrite will peak.' },
      { title: 'What staging does', body: 'Adding ten a week lets each population catch up before the next batch. Compare the two peaks, and remember: your water tests decide, not the forecast.' },
    ],
  },
  {
    key: 'rehoming-half',
    title: 'Rehoming half a tank, then restocking',
    summary: 'Twenty of forty platies go to a club member. A month later thirty young platies arrive.',
    kind: 'single',
    scenario: {
      name: 'Twenty rehomed on day 1, thirty in on day 30',
      horizonDays: 45,
      // A filter sized for forty platies: the settled tank reads clean before the change.
      tank: { ...matureTank(120, 3, 1.3), ph: 7.6, khDegrees: 8 },
      start: { kind: 'mature' },
      fish: [{ species: 'platy', count: 40 }],
      events: [
        { type: 'move-fish', day: 1, direction: 'out', otherTank: "club member's tank", fish: { species: 'platy', count: 20 } },
        { type: 'add-fish', day: 30, fish: { species: 'platy', count: 30 } },
        ...weeklyChanges([7, 14, 21, 28, 35, 42], 30),
      ],
    },
    steps: [
      { title: 'Less food for the biofilter', body: 'With half the fish gone, the filter bacteria slowly shrink toward the smaller load: little in the first days, more after a few weeks.' },
      { title: 'The restock', body: 'On day 30 thirty platies arrive. The biofilter is now sized for twenty fish, not fifty, so ammonia shows on a test kit for a few days.' },
      { title: 'Your guess', body: 'The nitrite eaters shrank less than the ammonia eaters had to grow. Where will nitrite peak after the restock? Drag the marker.' },
      { title: 'The lesson', body: 'Rehome to another keeper or a shop, never into the wild (follow your local rules). To keep the capacity, feed the tank ammonia while it is lightly stocked.' },
    ],
  },
  {
    key: 'empty-tank-kept-ready',
    title: 'An empty tank kept ready',
    summary: 'A 60 L quarantine tank stands empty for six weeks before twenty fish arrive. Fed or not fed?',
    kind: 'compare',
    scenario: {
      name: 'Left empty, nothing fed',
      horizonDays: 56,
      tank: { ...matureTank(60, 0.5, 0.7), aeration: 'air-stone' },
      start: { kind: 'mature', loadMgNPerDay: 20 },
      events: [{ type: 'add-fish', day: 42, fish: { species: 'zebra-danio', count: 20 } }, ...weeklyChanges([7, 14, 21, 28, 35, 49])],
    },
    stagedScenario: {
      name: 'Fed ammonia every two days',
      horizonDays: 56,
      tank: { ...matureTank(60, 0.5, 0.7), aeration: 'air-stone' },
      start: { kind: 'mature', loadMgNPerDay: 20 },
      events: [
        { type: 'ammonia-dose', day: 0, amount: { unit: 'mgN-per-L', value: 0.6 }, repeatEveryDays: 2, repeatCount: 21 },
        { type: 'add-fish', day: 42, fish: { species: 'zebra-danio', count: 20 } },
        ...weeklyChanges([7, 14, 21, 28, 35, 49]),
      ],
    },
    steps: [
      { title: 'A biofilter without food', body: 'Nitrifiers live on ammonia. In an empty tank they have none: they hold on for a week or two, then their numbers fall fast.' },
      { title: 'Arrival day', body: 'Twenty danios arrive on day 42. Guess where nitrite peaks in the tank that was left empty.' },
      { title: 'Feeding the filter', body: 'Dosing a little ammonia every two days keeps the populations alive. Handle ammonia solutions with gloves and eye protection, in a ventilated place, and use a product without surfactants or scent.' },
    ],
  },
  {
    key: 'filter-rinsed-in-tap-water',
    title: 'A filter rinsed in tap water',
    summary: 'The sponge of a settled 60 L tank gets a thorough rinse under the chlorinated tap on day 3.',
    kind: 'single',
    scenario: {
      name: 'Sponge rinsed under the tap on day 3',
      horizonDays: 28,
      tank: matureTank(60, 1.5, 1),
      start: { kind: 'mature' },
      fish: [
        { species: 'cherry-barb', count: 8 },
        { species: 'bronze-corydoras', count: 5 },
      ],
      events: [{ type: 'filter-clean', day: 3, zoneId: 'filter', action: 'rinse', shareLost: 0.8 }, ...weeklyChanges([10, 17, 24])],
    },
    steps: [
      { title: 'Most of the biofilter lives in the filter', body: 'The sponge holds most of the filter bacteria; glass and decor hold the rest.' },
      { title: 'Chlorine and a hard squeeze', body: 'Rinsing under chlorinated tap water kills most of them (here: four in five). The fish keep making the same waste.' },
      { title: 'Your guess', body: 'Drag the marker to where you think nitrite peaks.' },
      { title: 'Doing it gently', body: 'Squeeze the sponge in a bucket of old tank water instead, and clean filter and gravel on different weeks.' },
    ],
  },
];
