/**
 * How heavily a tank is stocked: the fish's total mass per litre of water, judged against
 * common practice. A warning, not a refusal, until the fish could not fit in the water at all.
 */
import { DEFAULT_PARAMETERS } from './parameters';
import { FishLedger, fishKey } from './fish-ledger';
import { formatFigure } from './format-number';
import type { FishGroup, ScenarioEvent } from './scenario';

/**
 * Above this a tank is stocked far more heavily than home tanks usually are, g fish per litre
 * [practice, from memory]: well-stocked community tanks hold about 0.2–3 g/L (40 neon tetras
 * in 60 L ≈ 0.2 g/L; one adult oscar in 200 L ≈ 3.5 g/L), and the pond keepers' rule of
 * thumb is about 1 kg of fish per 1000 L. Intensive aquaculture goes far higher only with
 * pure oxygen, heavy water exchange and large biofilters.
 */
export const HEAVY_STOCKING_G_PER_L = 5;

/**
 * Above this the input cannot be a tank, g fish per litre: the fish would weigh more than a
 * quarter of the water (fish are about as dense as water), beyond even the densest intensive
 * aquaculture (about 100–150 kg per m³, from memory). The engine refuses it.
 */
export const ABSURD_STOCKING_G_PER_L = 250;

export type StockingLevel = 'usual' | 'heavy' | 'absurd';

/** Fish mass per litre and its level. */
export function stockingLevel(fishMassG: number, volumeL: number): { gPerL: number; level: StockingLevel } {
  const gPerL = volumeL > 0 ? fishMassG / volumeL : Infinity;
  return { gPerL, level: gPerL > ABSURD_STOCKING_G_PER_L ? 'absurd' : gPerL > HEAVY_STOCKING_G_PER_L ? 'heavy' : 'usual' };
}

/** "420 g", "2.6 kg", "67 t". */
function massWords(g: number): string {
  if (g >= 1e6) return `${formatFigure(g / 1e6)} t`;
  if (g >= 1000) return `${formatFigure(g / 1000)} kg`;
  return `${formatFigure(g)} g`;
}

/** The refusal's words; `volume` is the tank's size as the keeper reads it, e.g. "120 L". */
export function absurdStockingMessage(fishMassG: number, volumeL: number, volume = `${formatFigure(volumeL)} L`): string {
  return `These fish would weigh about ${massWords(fishMassG)} in ${volume} of water, more than a quarter of the water's own weight: no tank can hold that. Check the count and the tank size.`;
}

/**
 * A plain warning when the fish are far beyond common practice (or the refusal's words when
 * absurd); null when the stocking is usual. `volume` is the tank's size in the keeper's units.
 */
export function stockingWarning(fishMassG: number, volumeL: number, volume = `${formatFigure(volumeL)} L`): string | null {
  const { gPerL, level } = stockingLevel(fishMassG, volumeL);
  if (level === 'usual') return null;
  if (level === 'absurd') return absurdStockingMessage(fishMassG, volumeL, volume);
  const times = gPerL / HEAVY_STOCKING_G_PER_L;
  const howFar = times >= 2 ? `over ${Math.floor(times)} times` : 'more than';
  return (
    `These fish would weigh about ${massWords(fishMassG)} in ${volume}, ${howFar} the most that home tanks usually carry (common practice). ` +
    'Fish this crowded tend to run short of oxygen and foul the water faster than any forecast shows. Check the count and the tank size, or plan fewer fish.'
  );
}

/** Total mass of fish groups, g, at the engine's default length–mass exponent; a group the catalogue cannot size counts 0. */
export function groupsMassG(groups: readonly FishGroup[]): number {
  return fishMassOnDayG(groups, [], 0);
}

/**
 * The fish's total mass once the events up to `day` have happened (same-day events in their
 * order): the tank's fish at the start, then additions and moves in, less removals and moves
 * out (taking what is there). Fish the catalogue cannot size count 0.
 */
export function fishMassOnDayG(startFish: readonly FishGroup[], events: readonly ScenarioEvent[], day: number): number {
  const ledger = new FishLedger(DEFAULT_PARAMETERS.lengthWeightB);
  const add = (g: FishGroup) => {
    try {
      ledger.add(g);
    } catch {
      // An unknown species or a custom fish without its size: the form asks for it; no mass to count yet.
    }
  };
  startFish.forEach(add);
  const ordered = events.map((e, i) => ({ e, i })).sort((a, b) => a.e.day - b.e.day || a.i - b.i);
  for (const { e } of ordered) {
    if (e.day > day) break;
    if (e.type === 'add-fish' || (e.type === 'move-fish' && e.direction === 'in')) e.fish.forEach(add);
    else if (e.type === 'move-fish' || e.type === 'remove-fish') e.fish.forEach((g) => ledger.remove(fishKey(g), g.count));
  }
  return ledger.massG();
}
