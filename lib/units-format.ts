/**
 * Numbers in the person's units (pure). Shoalshift stores litres, °C and mg N/L; these
 * functions show them as the person chose (L or US gal, °C or °F, "as N" or "as the ion")
 * and turn what they type back into stored units. Conversions come from simulation/units.ts
 * (one source of truth); the ion of each nitrogen value from shared/schemas/reading.ts.
 */
import { fromMgN, ION_OF, toMgN, type NitrogenKey } from '@/shared/schemas/reading';
import type { NitrogenBasis, TemperatureUnit, UnitPreferences, VolumeUnit } from '@/shared/schemas/preferences';
import { celsiusToFahrenheit, fahrenheitToCelsius, litresToUsGallons, usGallonsToLitres } from '@/simulation/units';
import { formatConcentration as formatMgPerL, formatTemperatureFigure, formatVolumeFigure, trimDecimals } from '@/simulation/format-number';

/** At most `digits` decimals, trailing zeros dropped (simulation/format-number.ts): for edit fields. */
export const trimNumber = trimDecimals;

export const VOLUME_UNIT_LABEL: Record<VolumeUnit, string> = { L: 'L', USgal: 'US gal' };
export const TEMPERATURE_UNIT_LABEL: Record<TemperatureUnit, string> = { C: '°C', F: '°F' };

/** Litres in the person's volume unit, as a number. */
export function volumeIn(litres: number, unit: VolumeUnit): number {
  return unit === 'L' ? litres : litresToUsGallons(litres);
}

/** "120 L" or "31.7 US gal". */
export function formatVolume(litres: number, unit: VolumeUnit): string {
  return `${formatVolumeFigure(volumeIn(litres, unit))} ${VOLUME_UNIT_LABEL[unit]}`;
}

export function temperatureIn(celsius: number, unit: TemperatureUnit): number {
  return unit === 'C' ? celsius : celsiusToFahrenheit(celsius);
}

/** "25 °C" or "77 °F". */
export function formatTemperature(celsius: number, unit: TemperatureUnit): string {
  return `${formatTemperatureFigure(temperatureIn(celsius, unit))} ${TEMPERATURE_UNIT_LABEL[unit]}`;
}

/** "mg/L as N" or the ion's unit, and a stored value in the basis: shared with the server's words. */
export { formatNitrogen, nitrogenUnit } from '@/shared/nitrogen-format';

/** The basis in words, for captions: "as N" or "as the ion (NH4+, NO2−, NO3−)". */
export function basisWords(basis: NitrogenBasis): string {
  return basis === 'N' ? 'as N' : 'as the ion (NH4+, NO2−, NO3−)';
}

/** A stored mg N/L value in the person's basis, as a number. */
export function nitrogenIn(mgN: number, key: NitrogenKey, basis: NitrogenBasis): number {
  return fromMgN(mgN, key, basis);
}


/**
 * What a person typed as a number: decimal comma or dot, surrounding spaces allowed. Empty →
 * null; anything else that is not a plain number → NaN (the form shows a message).
 */
export function parseDecimal(text: string): number | null {
  const t = text.trim().replace(',', '.');
  if (t === '') return null;
  return /^[+-]?(\d+(\.\d*)?|\.\d+)$/.test(t) ? Number(t) : Number.NaN;
}

/** Typed volume (in the person's unit) → litres. */
export function volumeToLitres(value: number, unit: VolumeUnit): number {
  return unit === 'L' ? value : usGallonsToLitres(value);
}

/** Typed temperature (in the person's unit) → °C. */
export function temperatureToCelsius(value: number, unit: TemperatureUnit): number {
  return unit === 'C' ? value : fahrenheitToCelsius(value);
}

/** Typed nitrogen value (in `basis`) → mg N/L. */
export function nitrogenToMgN(value: number, key: NitrogenKey, basis: NitrogenBasis): number {
  return toMgN(value, key, basis);
}

/** A stored value as the text an edit field starts with, in the person's unit. */
export function volumeInputText(litres: number, unit: VolumeUnit): string {
  return trimNumber(volumeIn(litres, unit), 2);
}

export function temperatureInputText(celsius: number, unit: TemperatureUnit): string {
  return trimNumber(temperatureIn(celsius, unit), 1);
}

/** All three units of a person, in one line for captions: "US gal · °F · as the ion". */
export function unitsSummary(p: UnitPreferences): string {
  return [VOLUME_UNIT_LABEL[p.volumeUnit], TEMPERATURE_UNIT_LABEL[p.temperatureUnit], p.nitrogenBasis === 'N' ? 'as N' : 'as the ion'].join(' · ');
}
