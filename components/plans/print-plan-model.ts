/**
 * The printed plan as data (pure, no React Native): the tank's facts and fish in the keeper's
 * units, one row per day with something to do or test (to the last check day), the limits
 * with their basis, and the cautions said once. The screen only lays these out.
 */
import type { PlanDetail } from '@/shared/schemas/plan';
import type { UnitPreferences } from '@/shared/schemas/preferences';
import type { TankDetail } from '@/shared/schemas/tank';
import type { ForecastView } from '@/shared/schemas/plan';
import { addDays } from '@/shared/plan-check-days';
import { ESTIMATE_CAUTIONS } from '@/simulation/advice/cautions';
import { formatTemperature, formatVolume, nitrogenUnit } from '@/lib/units-format';
import { forecastLimitRows, LIMIT_BASIS, nitrogenText } from '@/lib/forecast-limits';
import { plainNumber } from '@/shared/forecast-view';
import { speciesDisplayName } from '@/components/tanks/tank-labels';
import { describeEvent } from '@/components/plans/event-fields';
import { fishName } from '@/components/plans/event-kinds';
import { FILTER_KIND_CHOICES } from '@/components/tanks/tank-form-model';

/** One row of the printed plan: what to do and what to test on one day. */
export interface PrintDay {
  day: number;
  date: string;
  todo: string[];
  tests: string[];
}

/** The plan's days that have something to do or test, in order, to its last check day. */
export function printDays(plan: Pick<PlanDetail, 'startDate' | 'events' | 'checkDays'>): PrintDay[] {
  const byDay = new Map<number, PrintDay>();
  const at = (day: number) => {
    const d = Math.round(day);
    if (!byDay.has(d)) byDay.set(d, { day: d, date: addDays(plan.startDate, d), todo: [], tests: [] });
    return byDay.get(d)!;
  };
  for (const e of plan.events) at(e.day).todo.push(describeEvent(e));
  for (const c of plan.checkDays) at(c.day).tests.push(`Test total ammonia and nitrite: ${c.reasons.join('; ')}`);
  return [...byDay.values()].sort((a, b) => a.day - b.day);
}

/** The reading columns of the day table, headed in the keeper's basis. */
export function readingColumns(basis: UnitPreferences['nitrogenBasis']): { key: 'tanMgN' | 'no2MgN' | 'no3MgN'; title: string; unit: string }[] {
  return [
    { key: 'tanMgN', title: 'Ammonia', unit: nitrogenUnit('tanMgN', basis) },
    { key: 'no2MgN', title: 'Nitrite', unit: nitrogenUnit('no2MgN', basis) },
    { key: 'no3MgN', title: 'Nitrate', unit: nitrogenUnit('no3MgN', basis) },
  ];
}

export interface Fact {
  label: string;
  value: string;
}

const FILTER_LABEL = Object.fromEntries(FILTER_KIND_CHOICES.map((c) => [c.value, c.label])) as Record<(typeof FILTER_KIND_CHOICES)[number]['value'], string>;

/** Volume, temperature, pH and filter, in the keeper's units. */
export function tankFacts(tank: Pick<TankDetail, 'volumeL' | 'temperatureC' | 'ph' | 'khDkh' | 'setup'>, units: UnitPreferences): Fact[] {
  const f = tank.setup.filter;
  const facts: Fact[] = [
    { label: 'Volume', value: formatVolume(tank.volumeL, units.volumeUnit) },
    { label: 'Temperature', value: formatTemperature(tank.temperatureC, units.temperatureUnit) },
    { label: 'pH', value: plainNumber(tank.ph) },
  ];
  if (tank.khDkh !== null) facts.push({ label: 'Carbonate hardness', value: `${plainNumber(tank.khDkh)} dKH` });
  facts.push({
    label: 'Filter',
    value: f ? `${FILTER_LABEL[f.kind]}${f.kind === 'sump' ? '' : ' filter'}, ${formatVolume(f.mediaVolumeL, units.volumeUnit)} of media` : 'Not described',
  });
  return facts;
}

export interface FishLists {
  /** "12 Neon tetra" for each group in the tank when the plan starts. */
  now: string[];
  /** Fish the plan brings in, summed per kind. */
  added: string[];
  /** Fish the plan rehomes or moves out, summed per kind. */
  leaving: string[];
}

function tally(into: Map<string, number>, name: string, count: number) {
  into.set(name, (into.get(name) ?? 0) + count);
}
const lines = (m: Map<string, number>) => [...m.entries()].map(([name, n]) => `${n} ${name}`);

/** The fish in the tank now, and the ones the plan adds and takes out. */
export function fishLists(tank: Pick<TankDetail, 'livestock'>, plan: Pick<PlanDetail, 'events'>): FishLists {
  const now = new Map<string, number>();
  for (const l of tank.livestock) if (l.count > 0) tally(now, speciesDisplayName(l), l.count);
  const added = new Map<string, number>();
  const leaving = new Map<string, number>();
  for (const e of plan.events) {
    if (e.type !== 'add-fish' && e.type !== 'move-fish' && e.type !== 'remove-fish') continue;
    const into = e.type === 'add-fish' || (e.type === 'move-fish' && e.direction === 'in') ? added : leaving;
    for (const g of e.fish) tally(into, fishName(g.species, g.name), g.count);
  }
  return { now: lines(now), added: lines(added), leaving: lines(leaving) };
}

export interface PrintLimit {
  name: string;
  value: string;
  basis: string;
}

/** Each limit the forecast is held to, with its value in the keeper's basis and where it comes from. */
export function printLimits(view: ForecastView, basis: UnitPreferences['nitrogenBasis']): PrintLimit[] {
  const out: PrintLimit[] = [];
  for (const r of forecastLimitRows(view, basis)) {
    if (!r.limit) continue;
    out.push({ name: r.key === 'tan' ? 'Total ammonia, long-term' : r.name, value: r.limit.value, basis: r.limit.basis });
    if (r.key === 'tan') out.push({ name: 'Total ammonia, short-term', value: nitrogenText(view.limits.tanAcuteMgN, 'tanMgN', basis), basis: LIMIT_BASIS.tanAcute });
  }
  return out;
}

/** If a reading is high (common practice; the steps the estimate cautions give, in full). */
export const IF_HIGH = [
  'Total ammonia or nitrite over the limit: change 25–50 % of the water with treated, temperature-matched water the same day.',
  'Feed half or skip a day; do not add more fish until two tests in a row are back under the limits.',
  'Test again the next day; repeat the water change if it is still high.',
  'Fish gasping, lying on the bottom or with red gills: act now, and ask a qualified aquatic veterinarian.',
];

/** Cautions the "If a reading is high" steps already say in full; the page says them once. */
const SAID_BY_IF_HIGH = new Set([ESTIMATE_CAUTIONS[1], ESTIMATE_CAUTIONS[2]]);

/** The plan's cautions for paper: each once, without the ones the high-reading steps cover. */
export function keepInMind(cautions: readonly string[]): string[] {
  return [...new Set(cautions)].filter((c) => !SAID_BY_IF_HIGH.has(c));
}
