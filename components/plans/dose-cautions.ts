/**
 * The dose form's cautions (pure, no React Native): handling ammonia always, and dosing with
 * fish present when the tank holds fish on the dose's day. The words are the engine's
 * (simulation/advice/cautions.ts), said the same on the form as beside the advice.
 */
import { AMMONIA_HANDLING_CAUTIONS, DOSING_WITH_FISH_CAUTIONS } from '@/simulation/advice/cautions';

export interface DoseFormCautions {
  handling: readonly string[];
  /** empty when no fish are in the tank */
  withFish: readonly string[];
}

export function doseFormCautions(fishInTank: number): DoseFormCautions {
  return { handling: AMMONIA_HANDLING_CAUTIONS, withFish: fishInTank > 0 ? DOSING_WITH_FISH_CAUTIONS : [] };
}
