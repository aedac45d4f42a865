/**
 * The start line above a forecast, and its warnings: what the forecast started from
 * (shared/tank-start.ts), in the keeper's units. The one source of this wording, for the plan
 * screen, the printable plan and the server's explanation.
 */
import { findSpecies } from '../simulation/catalogue';
import { formatNitrogen, nitrogenUnit } from './nitrogen-format';
import type { NitrogenBasis } from './schemas/preferences';
import type { StartState, StartWarning } from './schemas/start-state';
import type { TankHistory } from './schemas/tank-history';
import { TEST_START_MAX_DAYS } from './tank-start';

const DAY_FORMAT = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });
/** "3 Dec" (UTC, as the rule counts days). */
export function startDay(iso: string): string {
  const t = Date.parse(iso.length === 10 ? `${iso}T00:00:00Z` : iso);
  return Number.isNaN(t) ? 'an unknown date' : DAY_FORMAT.format(new Date(t));
}

const fishWords = (h: Extract<TankHistory, { kind: 'emptied' }>) =>
  h.formerFish.map((f) => `${f.count} ${findSpecies(f.speciesId)?.commonName ?? f.speciesId}`).join(', ');

/** The nitrifiers' source: the sentence when no test gives the water, and the clause after a test's values. */
function nitrifierWords(state: StartState): { alone: string; afterTest: string } {
  const h = state.history;
  const as = (tank: string) => ({ alone: `Starts as ${tank}.`, afterTest: `in ${tank}` });
  switch (state.reason) {
    case 'given':
      return { alone: 'Starts from the state you chose for the tank.', afterTest: 'with the nitrifiers you chose' };
    case 'fitted': {
      const fitted = `the nitrifiers fitted to your tests on ${startDay(state.fittedAt ?? '')}`;
      return { alone: `Starts from ${fitted}.`, afterTest: `with ${fitted}` };
    }
    case 'described-settled':
      return as('a settled tank (as you describe it) whose nitrifiers match the fish it holds now');
    case 'mature-present-load':
      return as('a settled tank whose nitrifiers match the fish it holds now');
    case 'described-new':
      return as('a new tank (as you describe it) with hardly any nitrifiers');
    case 'described-emptied':
      return as(h?.kind === 'emptied' ? `a tank whose filter fed ${fishWords(h)} until ${startDay(h.matureUntil)} and has had no fish since` : 'a tank whose filter has had no fish for a while');
    case 'described-seeded':
      return as(h?.kind === 'seeded' ? `a new tank whose filter holds ${h.sharePercent} % media from a mature filter` : 'a new tank seeded with mature media');
    case 'new-unseeded':
      return as('a new tank with hardly any nitrifiers (no fish and no water tests yet)');
    case 'new-no-fish':
      return { alone: 'Starts with hardly any nitrifiers: the tank holds no fish, so nothing is known to have fed its biofilter.', afterTest: 'with hardly any nitrifiers (the tank holds no fish)' };
  }
}

function testValues(t: { tanMgN: number | null; no2MgN: number | null; no3MgN?: number | null }, basis: NitrogenBasis): string {
  const parts = [
    t.tanMgN !== null ? `total ammonia ${formatNitrogen(t.tanMgN, 'tanMgN', basis)}` : null,
    t.no2MgN !== null ? `nitrite ${formatNitrogen(t.no2MgN, 'no2MgN', basis)}` : null,
    t.no3MgN !== undefined && t.no3MgN !== null ? `nitrate ${formatNitrogen(t.no3MgN, 'no3MgN', basis)}` : null,
  ].filter((p): p is string => p !== null);
  // As N every value shares one unit; as the ion each has its own, so each is named.
  return basis === 'N' ? `${parts.join(', ')} ${nitrogenUnit('tanMgN', basis)}` : `${parts.join(', ')} (${nitrogenUnit('tanMgN', basis)}, ${nitrogenUnit('no2MgN', basis)}, ${nitrogenUnit('no3MgN', basis)})`;
}

/** One line: "From your test of 3 Dec: total ammonia 2, nitrite 1 mg/L as N, in a settled tank …". */
export function startLine(state: StartState, basis: NitrogenBasis): string {
  const words = nitrifierWords(state);
  return state.test?.used ? `From your test of ${startDay(state.test.takenAt)}: ${testValues(state.test, basis)}, ${words.afterTest}.` : words.alone;
}

const startOn = (state: StartState) => (state.startDate ? ` (${startDay(state.startDate)})` : '');

function warningLine(w: StartWarning, state: StartState, basis: NitrogenBasis): string {
  switch (w.kind) {
    case 'test-old':
      return `Your latest test (${startDay(w.takenAt)}) was taken more than ${TEST_START_MAX_DAYS} days before this forecast starts${startOn(state)}, too old to start from: test the water on the start day and the forecast starts from it.`;
    case 'test-contradicts-settled':
      return `Your test of ${startDay(w.takenAt)} shows ${testValues(w, basis)}, which a settled tank does not read: its nitrifiers may be fewer than assumed. Describe the tank's past on the tank page, or fit the model to your tests.`;
    case 'fit-other-zones':
      return `The fit of ${startDay(w.fittedAt)} was made for a different filter and substrate, so it is not used: fit again.`;
  }
}

/** The start's warnings, one line each (none when the evidence agrees). */
export function startWarningLines(state: StartState, basis: NitrogenBasis): string[] {
  return state.warnings.map((w) => warningLine(w, state, basis));
}
