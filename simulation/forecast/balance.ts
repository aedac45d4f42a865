/**
 * Nitrogen bookkeeping of a run: every input and output the events and feeding add up, and
 * the residual that checks the integration (stored at the end − at the start − net inputs).
 */
import { aoIndex, I_NO2, I_NO3, I_ORG, I_PLANT, I_TAN, noIndex, type Model } from '../model';

export interface NitrogenBalance {
  /** N in food offered, mg */
  feedOfferedMg: number;
  /** N kept in fish growth (leaves the water), mg */
  fishRetainedMg: number;
  dosedMg: number;
  tapWaterMg: number;
  waterChangeRemovedMg: number;
  /** nitrifier biomass N rinsed out or thrown away with media, mg */
  mediaCleaningMg: number;
  plantUptakeMg: number;
  /** dissolved + detritus + biomass N at start and end, mg */
  storedStartMg: number;
  storedEndMg: number;
  /** storedEnd − storedStart − (inputs − outputs) */
  residualMg: number;
  /** residual / largest of the terms */
  relativeResidual: number;
}

/** The balance and the doses given (by time, for the summary's recent dose). */
export interface NitrogenLedger {
  balance: NitrogenBalance;
  /** pulses (from = to) and stretches of continuous dosing, mg each */
  doses: { from: number; to: number; mg: number }[];
  /** Plant uptake state at the start (the state vector accumulates uptake). */
  plantStart: number;
}

/** Dissolved, detritus and biomass nitrogen in the tank, mg. */
export function storedNitrogen(model: Model, s: ArrayLike<number>): number {
  const V = model.volumeL;
  const bn = model.biomassNPerCapacity;
  let total = V * (s[I_TAN] + s[I_NO2] + s[I_NO3] + s[I_ORG]);
  for (let z = 0; z < model.zones.length; z++) total += bn.ao * s[aoIndex(z)] + bn.no * s[noIndex(z)];
  return total;
}

export function openLedger(model: Model, y: readonly number[]): NitrogenLedger {
  return {
    balance: {
      feedOfferedMg: 0,
      fishRetainedMg: 0,
      dosedMg: 0,
      tapWaterMg: 0,
      waterChangeRemovedMg: 0,
      mediaCleaningMg: 0,
      plantUptakeMg: 0,
      storedStartMg: storedNitrogen(model, y),
      storedEndMg: 0,
      residualMg: 0,
      relativeResidual: 0,
    },
    doses: [],
    plantStart: y[I_PLANT],
  };
}

/** Food offered and kept by the fish over a segment of `days` at constant flows. */
export function noteFeeding(ledger: NitrogenLedger, flows: { offeredN: number; retained: number }, days: number): void {
  ledger.balance.feedOfferedMg += flows.offeredN * days;
  ledger.balance.fishRetainedMg += flows.retained * days;
}

/** Continuous dosing over a segment [from, to] at `flowMgNPerLPerDay` in a tank of `volumeL`. */
export function noteDoseFlow(ledger: NitrogenLedger, flowMgNPerLPerDay: number, volumeL: number, from: number, to: number): void {
  if (flowMgNPerLPerDay === 0) return;
  const mg = flowMgNPerLPerDay * volumeL * (to - from);
  ledger.balance.dosedMg += mg;
  ledger.doses.push({ from, to, mg });
}

/** Closes the balance on the end state y. */
export function closeLedger(ledger: NitrogenLedger, model: Model, y: readonly number[]): NitrogenBalance {
  const balance = ledger.balance;
  balance.plantUptakeMg = y[I_PLANT] - ledger.plantStart;
  balance.storedEndMg = storedNitrogen(model, y);
  const inputs = balance.feedOfferedMg - balance.fishRetainedMg + balance.dosedMg + balance.tapWaterMg;
  const outputs = balance.waterChangeRemovedMg + balance.mediaCleaningMg + balance.plantUptakeMg;
  balance.residualMg = balance.storedEndMg - balance.storedStartMg - (inputs - outputs);
  const scale = Math.max(balance.storedStartMg, balance.storedEndMg, inputs, outputs, 1e-300);
  balance.relativeResidual = balance.residualMg / scale;
  return balance;
}
