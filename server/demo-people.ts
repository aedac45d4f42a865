/**
 * The invented demo accounts the seed creates (and the browser tests sign in with). Plain data,
 * no database code, so tests can import it without loading TypeORM.
 */
export const DEMO_PEOPLE = [
  { key: 'organizer', email: 'hazel@quillwater.example', displayName: 'Hazel Okafor', password: 'otter-lantern-basin-31', site: 'user', club: 'organizer' },
  { key: 'mentor', email: 'tomas@quillwater.example', displayName: 'Tomás Lind', password: 'reedbed-compass-harbor-58', site: 'user', club: 'mentor' },
  { key: 'member', email: 'priya@quillwater.example', displayName: 'Priya Nair', password: 'moss-kettle-ferry-24', site: 'user', club: 'member' },
  { key: 'admin', email: 'admin@shoalshift.example', displayName: 'Site Admin', password: 'granite-heron-ledger-77', site: 'admin', club: null },
  { key: 'keeper', email: 'sam@keepers.example', displayName: 'Sam Rivera', password: 'driftwood-maple-signal-12', site: 'user', club: null },
] as const;
