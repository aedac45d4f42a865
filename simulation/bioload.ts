/**
 * Fish as the source of nitrogen (MODEL.md §6). Pure arithmetic; the engine calls
 * `feedNitrogenFlows` once per integration segment.
 */
import { SHAPE_CLASSES, findSpecies, type ShapeClass } from './catalogue';
import type { Parameters } from './parameters';

/** Mass of one fish in g from length in cm: W = a·L^b (Froese 2006, J. Appl. Ichthyol. 22:241). */
export function massFromLength(lengthCm: number, a: number, b: number): number {
  return a * Math.pow(lengthCm, b);
}

/** A group of identical animals, as the scenario describes them. */
export interface FishGroupSpec {
  species?: string;
  name?: string;
  count: number;
  lengthCm?: number;
  shape?: ShapeClass;
  massG?: number;
}

/** Mass of one animal of the group (g): explicit mass, else length × shape, else catalogue adult length. */
export function fishMassG(spec: FishGroupSpec, b: number): number {
  if (spec.massG !== undefined) return spec.massG;
  const entry = spec.species === undefined ? undefined : findSpecies(spec.species);
  const length = spec.lengthCm ?? entry?.adultLengthCm;
  const shape = spec.shape ?? entry?.shape ?? 'ordinary';
  if (length === undefined) throw new RangeError(`fish "${spec.name ?? spec.species}" needs lengthCm or massG`);
  return massFromLength(length, SHAPE_CLASSES[shape].a, b);
}

/** TAN-N excreted (g) from feed (g) at a protein share: feed × protein × 0.092 (Timmons & Ebeling). */
export function tanFromFeed(feedG: number, proteinShare: number, tanPerProtein = 0.092): number {
  return feedG * proteinShare * tanPerProtein;
}

/** How the tank is fed: grams per day, or a share of the fish's body mass. */
export type Feeding =
  | { mode: 'grams'; gramsPerDay: number; proteinShare?: number }
  | { mode: 'body-mass'; percentPerDay?: number; proteinShare?: number };

/** Nitrogen flows from feeding, mg N/day. */
export interface FeedFlows {
  /** feed offered, g/day */
  feedG: number;
  /** feed eaten, g/day */
  eatenG: number;
  /** N in the food offered */
  offeredN: number;
  /** TAN excreted into the water */
  excretedTan: number;
  /** faeces, non-TAN excretion and uneaten food → detritus (ORG) */
  toOrg: number;
  /** N kept in fish growth (leaves the water) */
  retained: number;
}

/**
 * Splits the day's food N: fish eat up to their appetite; eaten N goes to TAN (0.092 g per g
 * protein), fish growth (retention share) and faeces (the rest → ORG); uneaten food → ORG.
 * Hence removing fish at constant grams of food does not lower the long-run load, only shifts
 * it from direct excretion to detritus.
 */
export function feedNitrogenFlows(fishMassTotalG: number, feeding: Feeding, p: Parameters, multiplier = 1): FeedFlows {
  const protein = feeding.proteinShare ?? p.proteinShare;
  // `multiplier` scales the food offered (an ensemble's feeding draw), in either mode.
  const feedG =
    feeding.mode === 'grams'
      ? feeding.gramsPerDay * multiplier
      : (fishMassTotalG * ((feeding.percentPerDay ?? p.feedPercent) * multiplier)) / 100;
  const eatenG = Math.min(feedG, (fishMassTotalG * p.appetite) / 100);
  const offeredN = 1000 * feedG * protein * p.nPerProtein;
  const eatenN = 1000 * eatenG * protein * p.nPerProtein;
  const excretedTan = 1000 * eatenG * protein * p.tanPerProteinFed;
  const retained = eatenN * p.fishRetention;
  const toOrg = offeredN - excretedTan - retained;
  return { feedG, eatenG, offeredN, excretedTan, toOrg, retained };
}
