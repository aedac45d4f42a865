import { DEFAULT_PREFERENCES, type Preferences } from '../../shared/schemas/preferences.js';
import type { UserPreferences } from '../entities/user-preferences.js';

/** Display preferences as the API shows them: the stored choice, or the defaults when none. */
export function presentPreferences(row: UserPreferences | null): Preferences {
  if (!row) return { ...DEFAULT_PREFERENCES };
  return { volumeUnit: row.volumeUnit, temperatureUnit: row.temperatureUnit, nitrogenBasis: row.nitrogenBasis, reminders: row.reminders };
}
