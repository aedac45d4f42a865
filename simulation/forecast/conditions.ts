/**
 * The conditions of a run that events change (temperature, feeding, fish mass, active
 * medications, aeration losses and continuous doses) and the model's segment conditions they give.
 */
import { feedNitrogenFlows, type FeedFlows, type Feeding } from '../bioload';
import { carbonateCo2 } from '../chemistry';
import type { SegmentConditions } from '../model';
import type { Parameters } from '../parameters';
import { AERATION_OXYGEN_SHARE, PLANTING_UPTAKE_SHARE } from '../presets';
import type { Tank } from '../scenario';

/** The tank's carbonate chemistry, fixed for the run. */
export interface TankChemistry {
  phModel: 'fixed' | 'carbonate';
  /** KH at day 0, °dKH (0 when not given). */
  kh0: number;
  /** CO2 that holds the day-0 pH at that KH (carbonate model), mg/L. */
  co2MgL: number;
  /** KH of tap water (defaults to the tank's). */
  tapKh: number;
}

export function tankChemistry(tank: Tank): TankChemistry {
  const phModel = tank.phModel ?? (tank.khDegrees !== undefined && tank.khDegrees > 0 ? 'carbonate' : 'fixed');
  const kh0 = tank.khDegrees ?? 0;
  return {
    phModel,
    kh0,
    co2MgL: phModel === 'carbonate' ? carbonateCo2(kh0, tank.ph, tank.temperatureC) : 0,
    tapKh: tank.tapWater.khDegrees ?? kh0,
  };
}

export interface RunConditions {
  temperatureC: number;
  feeding: Feeding;
  fishMassG: number;
  /** Active medications and aeration losses by event index → multiplier. */
  medications: Map<number, number>;
  aerationLosses: Map<number, number>;
  /** Continuous doses flowing now by event index → mg N/(L·d). */
  doseFlows: Map<number, number>;
  /** Nitrogen flows of the food at the present fish mass and feeding. */
  feedFlows: FeedFlows;
}

/** The feed's nitrogen flows at the conditions' fish mass and feeding (× the run's feeding multiplier). */
export function feedFlowsOf(c: Pick<RunConditions, 'fishMassG' | 'feeding'>, p: Parameters, feedingMultiplier: number): FeedFlows {
  return feedNitrogenFlows(c.fishMassG, c.feeding, p, feedingMultiplier);
}

/** The continuous doses flowing now, mg N/(L·d) in all. */
export function doseFlowOf(c: Pick<RunConditions, 'doseFlows'>): number {
  let total = 0;
  for (const rate of c.doseFlows.values()) total += rate;
  return total;
}

export function segmentConditions(tank: Tank, chemistry: TankChemistry, c: RunConditions, p: Parameters): SegmentConditions {
  let activity = 1;
  for (const m of c.medications.values()) activity *= m;
  let oxygen = AERATION_OXYGEN_SHARE[tank.aeration];
  for (const a of c.aerationLosses.values()) oxygen *= a;
  return {
    temperatureC: c.temperatureC,
    ph: tank.ph,
    phModel: chemistry.phModel,
    co2MgL: chemistry.co2MgL,
    oxygenShare: oxygen,
    activityMultiplier: activity,
    // A continuous dose enters the water as TAN, like the fish's own excretion.
    excretionTan: c.feedFlows.excretedTan / tank.volumeL + doseFlowOf(c),
    orgInput: c.feedFlows.toOrg / tank.volumeL,
    plantUptake: p.plantUptakeHeavy * PLANTING_UPTAKE_SHARE[tank.plants],
    lightHoursPerDay: tank.lightHoursPerDay,
  };
}
