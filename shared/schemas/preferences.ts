import { z } from 'zod';

export const volumeUnitSchema = z.enum(['L', 'USgal']);
export const temperatureUnitSchema = z.enum(['C', 'F']);
/** How ammonia, nitrite and nitrate are shown: as nitrogen, or as the ion. */
export const nitrogenBasisSchema = z.enum(['N', 'ion']);

export type VolumeUnit = z.infer<typeof volumeUnitSchema>;
export type TemperatureUnit = z.infer<typeof temperatureUnitSchema>;
export type NitrogenBasis = z.infer<typeof nitrogenBasisSchema>;

/** A person's display units and reminder choice (PUT replaces all of it). */
export const preferencesSchema = z.strictObject({
  volumeUnit: volumeUnitSchema,
  temperatureUnit: temperatureUnitSchema,
  nitrogenBasis: nitrogenBasisSchema,
  /** E-mail reminders on a running plan's test days. */
  reminders: z.boolean({ error: 'Choose on or off.' }),
});
export type Preferences = z.infer<typeof preferencesSchema>;
export type UnitPreferences = Pick<Preferences, 'volumeUnit' | 'temperatureUnit' | 'nitrogenBasis'>;

/** Until a person chooses: metric, as N (the basis Shoalshift stores), reminders on. */
export const DEFAULT_PREFERENCES: Preferences = {
  volumeUnit: 'L',
  temperatureUnit: 'C',
  nitrogenBasis: 'N',
  reminders: true,
};
