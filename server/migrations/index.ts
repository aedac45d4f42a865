import { InitialSchema1796162158000 } from './1796162158000-initial-schema.js';
import { IdempotencyKeys1796170000000 } from './1796170000000-idempotency-keys.js';
import { KeeperPreferencesAndReadingNotes1796172100000 } from './1796172100000-keeper-preferences-and-reading-notes.js';
import { ForecastCache1796180000500 } from './1796180000500-forecast-cache.js';
import { ClubsLessonsSharing1796300000000 } from './1796300000000-clubs-lessons-sharing.js';
import { ClubInviteRevocation1796312000000 } from './1796312000000-club-invite-revocation.js';
import { AuthAttempts1796313000000 } from './1796313000000-auth-attempts.js';
import { PendingSignUps1796315200000 } from './1796315200000-pending-sign-ups.js';
import { ReadingsUniqueTime1796316400000 } from './1796316400000-readings-unique-time.js';
import { EngineSlots1796321500000 } from './1796321500000-engine-slots.js';
import { InviteQuotaIndexes1796324100000 } from './1796324100000-invite-quota-indexes.js';
import { ShareLinksExpire1796324100100 } from './1796324100100-share-links-expire.js';
import { PlanLifecycle1796326000000 } from './1796326000000-plan-lifecycle.js';
import { FishEventGroups1796330000000 } from './1796330000000-fish-event-groups.js';
import { TankHistoryAndFits1796350300000 } from './1796350300000-tank-history-and-fits.js';

/** In order. Listed as classes (not globs) so tsx, compiled JS and vitest agree. */
export const migrations = [InitialSchema1796162158000, IdempotencyKeys1796170000000, KeeperPreferencesAndReadingNotes1796172100000, ForecastCache1796180000500, ClubsLessonsSharing1796300000000, ClubInviteRevocation1796312000000, AuthAttempts1796313000000, PendingSignUps1796315200000, ReadingsUniqueTime1796316400000, EngineSlots1796321500000, InviteQuotaIndexes1796324100000, ShareLinksExpire1796324100100, PlanLifecycle1796326000000, FishEventGroups1796330000000, TankHistoryAndFits1796350300000];
