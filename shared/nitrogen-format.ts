/**
 * A stored mg N/L value in the keeper's basis ("as N" or as the ion), for the screens
 * (lib/units-format.ts re-exports these) and for the words the server writes alike.
 */
import { formatConcentration } from '../simulation/format-number';
import type { NitrogenBasis } from './schemas/preferences';
import { fromMgN, ION_OF, type NitrogenKey } from './schemas/reading';

/** Short unit of a nitrogen value: "mg/L as N", or the ion ("mg/L NH4+", "mg/L NO2−", "mg/L NO3−"). */
export function nitrogenUnit(key: NitrogenKey, basis: NitrogenBasis): string {
  if (basis === 'N') return 'mg/L as N';
  const ion = { NH4: 'NH4+', NO2: 'NO2−', NO3: 'NO3−' }[ION_OF[key]];
  return `mg/L ${ion}`;
}

/** A stored mg N/L value for display in the basis (kit-style rounding, "—" for not tested). */
export function formatNitrogen(mgN: number | null, key: NitrogenKey, basis: NitrogenBasis): string {
  return mgN === null ? formatConcentration(null) : formatConcentration(fromMgN(mgN, key, basis));
}
