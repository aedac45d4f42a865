import { fishCount } from '@/shared/plan-check-days';
import { TANK_DEFAULTS, type LimitLevel, type LivestockItem, type NextTest, type PlanEvent, type PlanStatus, type TankSetup } from '@/shared/schemas/tank';
import type { AerationLevel, MediaType } from '@/simulation/scenario';
import { findSpecies } from '@/simulation/catalogue';
import { formatLitres } from '@/simulation/format-number';
import type { StatusTone } from '@/constants/theme';

/** The three nitrogen values a keeper tests, in the order the nitrogen cycle runs. */
export const NITROGEN_FIGURES = [
  { key: 'tanMgN', label: 'Total ammonia', short: 'Ammonia' },
  { key: 'no2MgN', label: 'Nitrite', short: 'Nitrite' },
  { key: 'no3MgN', label: 'Nitrate', short: 'Nitrate' },
] as const;

export const planStatusLabel: Record<PlanStatus, { label: string; tone: StatusTone }> = {
  draft: { label: 'Draft', tone: 'info' },
  active: { label: 'In progress', tone: 'ok' },
  done: { label: 'Finished', tone: 'info' },
};

/**
 * What to call a livestock row: the keeper's own name, else the starter catalogue's common
 * name, else the catalogue id read as words (an id the app's catalogue does not know yet).
 */
export function speciesDisplayName(item: Pick<LivestockItem, 'customName' | 'speciesId'>): string {
  if (item.customName && item.customName.trim()) return item.customName.trim();
  if (item.speciesId) {
    const known = findSpecies(item.speciesId);
    if (known) return known.commonName;
    const words = item.speciesId.replace(/[-_]+/g, ' ').trim();
    return words.charAt(0).toUpperCase() + words.slice(1);
  }
  return 'Unnamed animal';
}

const filterNames: Record<NonNullable<TankSetup['filter']>['kind'], string> = {
  'hang-on-back': 'Hang-on-back filter',
  canister: 'Canister filter',
  sponge: 'Sponge filter',
  internal: 'Internal filter',
  sump: 'Sump',
  trickle: 'Trickle filter',
};

const mediaNames: Record<MediaType, string> = {
  'sponge-coarse': 'coarse sponge',
  'sponge-fine': 'fine sponge',
  'ceramic-rings': 'ceramic rings',
  'plastic-carriers': 'plastic carriers',
  'lava-rock': 'lava rock',
  sand: 'sand',
  'fine-gravel': 'fine gravel',
  gravel: 'gravel',
  'coarse-gravel': 'coarse gravel',
};

const grainNames = { sand: 'Sand', 'fine-gravel': 'Fine gravel', gravel: 'Gravel', 'coarse-gravel': 'Coarse gravel' } as const;

const aerationNames: Record<AerationLevel, string> = {
  none: 'none',
  gentle: 'gentle',
  'surface-agitation': 'surface agitation',
  'air-stone': 'air stone',
  strong: 'strong',
};


/** One short line per part of the setup that is filled in; nothing for parts left out. */
export function setupLines(setup: TankSetup): string[] {
  const lines: string[] = [];
  if (setup.filter) {
    const { kind, media, mediaVolumeL, surfaceSkimmer } = setup.filter;
    const mediaText = media ? `${formatLitres(mediaVolumeL)} of ${mediaNames[media]}` : `${formatLitres(mediaVolumeL)} of media`;
    lines.push(`${filterNames[kind]}, ${mediaText}${surfaceSkimmer ? ', surface skimmer' : ''}`);
  }
  if (setup.substrate === 'bare') lines.push('Bare bottom');
  else if (setup.substrate) lines.push(`${grainNames[setup.substrate.grain]}, ${setup.substrate.depthCm} cm deep`);
  if (setup.plants && setup.plants !== 'none') lines.push(`Plants: ${setup.plants}`);
  if (setup.hardscape && setup.hardscape !== 'none') lines.push(`Rock and wood: ${setup.hardscape}`);
  if (setup.aeration) lines.push(`Aeration: ${aerationNames[setup.aeration]}`);
  if (setup.lightHoursPerDay !== undefined) lines.push(`Light: ${setup.lightHoursPerDay} h a day`);
  const wc = setup.routineWaterChange ?? TANK_DEFAULTS.routineWaterChange;
  lines.push(
    wc.percent > 0
      ? `Water change: ${wc.percent} % every ${wc.everyDays === 1 ? 'day' : `${wc.everyDays} days`}${setup.routineWaterChange ? '' : ' (assumed)'}`
      : 'No routine water changes',
  );
  if (setup.zones?.length) lines.push(`Surfaces for filter bacteria: ${setup.zones.length} set by hand`);
  return lines;
}

/** "3 steps · adds 12 fish · removes 2 fish": what a plan does, in one line. */
export function planSummary(events: readonly PlanEvent[]): string {
  let added = 0;
  let removed = 0;
  for (const e of events) {
    if (e.type === 'add-fish' || (e.type === 'move-fish' && e.direction === 'in')) added += fishCount(e.fish);
    else if (e.type === 'remove-fish' || e.type === 'move-fish') removed += fishCount(e.fish);
  }
  const parts = [`${events.length} ${events.length === 1 ? 'step' : 'steps'}`];
  if (added) parts.push(`adds ${added} fish`);
  if (removed) parts.push(`removes ${removed} fish`);
  return parts.join(' · ');
}

/** The home card's headline for the latest test, in words (the tint only repeats them). */
export const overallStatusLabel: Record<LimitLevel | 'none', { label: string; tone: StatusTone }> = {
  none: { label: 'No test yet', tone: 'info' },
  ok: { label: 'Water OK', tone: 'ok' },
  watch: { label: 'Watch', tone: 'watch' },
  over: { label: 'Over a limit', tone: 'danger' },
};

const NEXT_TEST_REASON: Record<NextTest['reason'], string> = {
  'no-test-yet': 'no test logged yet',
  'plan-check-day': "a check day of the running plan",
  'over-limit': 'the last test was over a limit',
  routine: 'a week after the last test',
};

/** "Next test: today (no test logged yet)", "Next test: overdue since 30 Nov (…)", "Next test: 3 Dec (…)". */
export function nextTestLabel(next: NextTest, now: Date, locale?: string): { text: string; overdue: boolean } {
  const todayUtc = now.toISOString().slice(0, 10);
  const when = new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', timeZone: 'UTC' }).format(new Date(`${next.date}T00:00:00Z`));
  const reason = next.detail ? `plan check day: ${next.detail}` : NEXT_TEST_REASON[next.reason];
  if (next.date === todayUtc) return { text: `Next test: today (${reason})`, overdue: false };
  if (next.date < todayUtc) return { text: `Next test: overdue since ${when} (${reason})`, overdue: true };
  return { text: `Next test: ${when} (${reason})`, overdue: false };
}

/** What to do when a test is over a limit (product brief point 10): water tests decide, act on them. */
export const OVER_LIMIT_ADVICE =
  'Ammonia or nitrite above its limit harms fish. Change part of the water now (same temperature, dechlorinated), feed less, and test again tomorrow. For questions about the fish’s health, ask a qualified aquatic veterinarian.';
