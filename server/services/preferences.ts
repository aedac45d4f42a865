import type { DataSource } from 'typeorm';
import type { Preferences } from '../../shared/schemas/preferences.js';
import { UserPreferences } from '../entities/user-preferences.js';

/** The person's stored preferences; null when they never chose (the defaults apply). */
export async function findPreferences(ds: DataSource, userId: string): Promise<UserPreferences | null> {
  return ds.getRepository(UserPreferences).findOneBy({ userId });
}

/** Replaces the person's preferences (one upsert) and reads them back. */
export async function putPreferences(ds: DataSource, userId: string, prefs: Preferences): Promise<UserPreferences | null> {
  await ds.getRepository(UserPreferences).upsert({ userId, ...prefs }, ['userId']);
  return findPreferences(ds, userId);
}
