/** Query-key factories, one per resource, so invalidation never guesses at key shapes. */
export const sessionKeys = {
  all: ['session'] as const,
  me: () => [...sessionKeys.all, 'me'] as const,
};

export const tankKeys = {
  all: ['tanks'] as const,
  list: () => [...tankKeys.all, 'list'] as const,
  detail: (id: string) => [...tankKeys.all, 'detail', id] as const,
};

export const devKeys = {
  all: ['dev'] as const,
  outbox: () => [...devKeys.all, 'outbox'] as const,
};
