import type { DataSource } from 'typeorm';
import { Club } from '../../../server/entities/club.js';
import { ClubMembership } from '../../../server/entities/club-membership.js';
import { Livestock } from '../../../server/entities/livestock.js';
import { Plan } from '../../../server/entities/plan.js';
import { Reading } from '../../../server/entities/reading.js';
import { Tank } from '../../../server/entities/tank.js';
import { User } from '../../../server/entities/user.js';
import { hashPassword } from '../../../server/services/passwords.js';
import type { ClubRole } from '../../../shared/schemas/auth.js';

/** A password that passes every rule; factories use it unless told otherwise. */
export const GOOD_PASSWORD = 'tidal-moss-lantern-42';

// bcrypt at cost 12 takes ~0.2 s; hash each distinct password once per test file.
const hashes = new Map<string, Promise<string>>();
const hashOnce = (password: string) => {
  if (!hashes.has(password)) hashes.set(password, hashPassword(password));
  return hashes.get(password)!;
};

let seq = 0;
const next = () => ++seq;

export async function createUser(ds: DataSource, overrides: Partial<User> & { password?: string } = {}): Promise<User> {
  const { password = GOOD_PASSWORD, ...rest } = overrides;
  const n = next();
  const repo = ds.getRepository(User);
  return repo.save(
    repo.create({
      email: `keeper${n}@example.org`,
      displayName: `Keeper ${n}`,
      role: 'user',
      passwordHash: await hashOnce(password),
      passwordChangedAt: new Date(Date.now() - 60_000),
      ...rest,
    }),
  );
}

export async function createTank(ds: DataSource, ownerId: string, overrides: Partial<Tank> = {}): Promise<Tank> {
  const repo = ds.getRepository(Tank);
  return repo.save(
    repo.create({
      ownerId,
      name: `Tank ${next()}`,
      volumeL: 120,
      temperatureC: 25,
      ph: 7.2,
      khDkh: 4,
      tapTanMgN: 0,
      tapNo2MgN: 0,
      tapNo3MgN: 1,
      setup: { filter: { kind: 'canister', mediaVolumeL: 1.5 }, substrate: { grain: 'sand', depthCm: 4 }, plants: 'light' },
      notes: '',
      ...overrides,
    }),
  );
}

export async function createLivestock(ds: DataSource, tankId: string, overrides: Partial<Livestock> = {}): Promise<Livestock> {
  const repo = ds.getRepository(Livestock);
  return repo.save(repo.create({ tankId, speciesId: 'neon-tetra', customName: null, count: 10, lengthCm: 3, ...overrides }));
}

/**
 * "Now", a millisecond later than the last default it gave: a tank holds one test per moment
 * (unique index), and two quick creates can fall in the same millisecond.
 */
let lastDefaultTime = 0;
const distinctNow = () => new Date((lastDefaultTime = Math.max(Date.now(), lastDefaultTime + 1)));

export async function createReading(ds: DataSource, tankId: string, overrides: Partial<Reading> = {}): Promise<Reading> {
  const repo = ds.getRepository(Reading);
  return repo.save(
    repo.create({
      tankId,
      takenAt: distinctNow(),
      tanMgN: 0.1,
      no2MgN: 0,
      no3MgN: 5,
      ph: 7.2,
      temperatureC: 25,
      khDkh: 4,
      basis: 'N',
      ...overrides,
    }),
  );
}

export async function createPlan(ds: DataSource, tankId: string, overrides: Partial<Plan> = {}): Promise<Plan> {
  const repo = ds.getRepository(Plan);
  return repo.save(
    repo.create({
      tankId,
      name: `Plan ${next()}`,
      startDate: '2026-01-10',
      status: 'draft',
      events: [{ type: 'add-fish', day: 0, fish: [{ species: 'neon-tetra', count: 6 }] }],
      // The database asks a running or finished plan for its start (and end) time.
      ...(overrides.status && overrides.status !== 'draft' ? { startedAt: new Date('2026-01-10T08:00:00Z') } : {}),
      ...(overrides.status === 'done' ? { finishedAt: new Date('2026-02-10T08:00:00Z') } : {}),
      ...overrides,
    }),
  );
}

export async function createClub(ds: DataSource, overrides: Partial<Club> = {}): Promise<Club> {
  const repo = ds.getRepository(Club);
  return repo.save(repo.create({ name: `Club ${next()}`, ...overrides }));
}

export async function addMember(ds: DataSource, clubId: string, userId: string, role: ClubRole): Promise<ClubMembership> {
  const repo = ds.getRepository(ClubMembership);
  return repo.save(repo.create({ clubId, userId, role }));
}
