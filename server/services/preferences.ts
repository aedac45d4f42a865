import type { DataSource } from 'typeorm';
import { DEFAULT_PREFERENCES, type Preferences } from '../../shared/schemas/preferences.js';
import { UserPreferences } from '../entities/user-preferences.js';

/** The person's preferences, or the defaults when they never chose. */
export async function getPreferences(ds: DataSource, userId: string): Promise<Preferences> {
  const row = await ds.getRepository(UserPreferences).findOneBy({ userId });
  if (!row) return { ...DEFAULT_PREFERENCES };
  return { volumeUnit: row.volumeUnit, temperatureUnit: row.temperatureUnit, nitrogenBasis: row.nitrogenBasis, reminders: row.reminders };
}

/** Replaces the person's preferences (one upsert). */
export async function putPreferences(ds: DataSource, userId: string, prefs: Preferences): Promise<Preferences> {
  await ds.getRepository(UserPreferences).upsert({ userId, ...prefs }, ['userId']);
  return getPreferences(ds, userId);
}
