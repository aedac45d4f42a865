import type { TankFit as TankFitShape } from '../../shared/schemas/tank-history.js';
import type { CalibrationAdviceResponse } from '../../shared/schemas/plan.js';
import type { TankFit } from '../entities/tank-fit.js';

export function presentTankFit(f: TankFit): TankFitShape {
  return {
    id: f.id,
    fittedAt: f.fittedAt.toISOString(),
    appliedAt: f.appliedAt ? f.appliedAt.toISOString() : null,
    lastReadingAt: f.lastReadingAt.toISOString(),
    readingsUsed: f.readingsUsed,
    verdict: f.verdict,
    capacities: f.capacities,
  };
}

/** The fit's answer with the kept fit as the wire shows it. */
export function presentCalibration<T extends Omit<CalibrationAdviceResponse, 'fit'>>(answer: T & { fit: TankFit }): CalibrationAdviceResponse {
  return { ...answer, fit: presentTankFit(answer.fit) };
}
