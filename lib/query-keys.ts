import type { TankDetail } from '@/shared/schemas/tank';

/** Query-key factories, one per resource, so invalidation never guesses at key shapes. */
export const sessionKeys = {
  all: ['session'] as const,
  me: () => [...sessionKeys.all, 'me'] as const,
};

export const tankKeys = {
  all: ['tanks'] as const,
  list: () => [...tankKeys.all, 'list'] as const,
  detail: (id: string) => [...tankKeys.all, 'detail', id] as const,
  /** A page of a tank's water tests (under the tank, so invalidating `all` refreshes them too). */
  readings: (id: string, page: number, pageSize: number) => [...tankKeys.all, 'readings', id, page, pageSize] as const,
  readingsOf: (id: string) => [...tankKeys.all, 'readings', id] as const,
  /** The tests taken while a plan ran (under the tank too: a new test refreshes them). */
  planReadings: (tankId: string, planId: string) => [...tankKeys.all, 'plan-readings', tankId, planId] as const,
};

export const preferenceKeys = {
  all: ['preferences'] as const,
  mine: () => [...preferenceKeys.all, 'mine'] as const,
};

export const devKeys = {
  all: ['dev'] as const,
  outbox: () => [...devKeys.all, 'outbox'] as const,
};

/**
 * The version a saved plan's forecast is cached under: the plan's own version and what its
 * start reads of the tank (latest test, applied fit, the keeper's account: shared/tank-start.ts),
 * so a new test, fit or account asks the server again.
 */
export function planForecastVersion(planUpdatedAt: string, tank: Pick<TankDetail, 'readings' | 'fit' | 'history'>): string {
  return [planUpdatedAt, tank.readings[0]?.id ?? '', tank.readings[0]?.takenAt ?? '', tank.fit?.id ?? '', JSON.stringify(tank.history)].join('|');
}

export const planKeys = {
  all: ['plans'] as const,
  list: () => [...planKeys.all, 'list'] as const,
  detail: (id: string) => [...planKeys.all, 'detail', id] as const,
  /** A saved plan's server forecast, per saved version (`updatedAt`). */
  forecast: (id: string, version: string) => [...planKeys.all, 'forecast', id, version] as const,
};

export const clubKeys = {
  all: ['clubs'] as const,
  list: () => [...clubKeys.all, 'list'] as const,
  detail: (id: string) => [...clubKeys.all, 'detail', id] as const,
  shares: (id: string) => [...clubKeys.all, 'shares', id] as const,
  share: (clubId: string, shareId: string) => [...clubKeys.all, 'share', clubId, shareId] as const,
  invite: (token: string) => [...clubKeys.all, 'invite', token] as const,
  /** A club's invites waiting for an answer (organizers). */
  invites: (clubId: string) => [...clubKeys.all, 'invites', clubId] as const,
};

export const lessonKeys = {
  all: ['lessons'] as const,
  list: () => [...lessonKeys.all, 'list'] as const,
  detail: (id: string) => [...lessonKeys.all, 'detail', id] as const,
  shared: (token: string) => [...lessonKeys.all, 'shared', token] as const,
  /** Share links of a plan or lesson (kept here with the public view they open). */
  links: (itemType: string, itemId: string) => ['share-links', itemType, itemId] as const,
};
