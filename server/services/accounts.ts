import type { DataSource } from 'typeorm';
import type { Db } from '../data-source.js';
import type { SignUpInput } from '../../shared/schemas/auth.js';
import { conflict, validationFailed } from '../errors.js';
import { ClubMembership } from '../entities/club-membership.js';
import { User } from '../entities/user.js';
import { COMMON_PASSWORD_MESSAGE, isCommonPassword } from '../security/common-passwords.js';
import { burnPasswordCheck, hashPassword, verifyPassword } from './passwords.js';

const EMAIL_TAKEN_MESSAGE = 'An account with this e-mail already exists. Sign in, or reset your password.';

function isUniqueViolation(err: unknown): boolean {
  return typeof err === 'object' && err !== null && (err as { code?: unknown }).code === '23505';
}

/** Refuses a chosen password that is on the common-password list (ASVS 6.2.4). */
export function assertPasswordNotCommon(password: string, email?: string): void {
  if (isCommonPassword(password, email)) throw validationFailed({ password: COMMON_PASSWORD_MESSAGE });
}

/** Inserts a keeper account (site role `user`) with an already made hash; the unique index on e-mail decides races. */
export async function createAccount(q: Db, fields: { email: string; displayName: string; passwordHash: string }): Promise<User> {
  const users = q.getRepository(User);
  try {
    return await users.save(users.create({ ...fields, role: 'user', passwordChangedAt: new Date() }));
  } catch (err) {
    // Two sign-ups racing for one address: the unique index decides.
    if (isUniqueViolation(err)) throw conflict(EMAIL_TAKEN_MESSAGE, { email: EMAIL_TAKEN_MESSAGE });
    throw err;
  }
}

/**
 * Creates a keeper account at once (an invite accepted while signed out: the invite's e-mail
 * proved the address). The public sign-up goes through server/services/sign-up.ts instead, which
 * does not tell who has an account. The e-mail arrives lower-cased from the schema.
 */
export async function signUp(ds: Db, input: SignUpInput): Promise<User> {
  assertPasswordNotCommon(input.password, input.email);
  if (await ds.getRepository(User).existsBy({ email: input.email })) throw conflict(EMAIL_TAKEN_MESSAGE, { email: EMAIL_TAKEN_MESSAGE });
  const passwordHash = await hashPassword(input.password);
  return createAccount(ds, { email: input.email, displayName: input.displayName, passwordHash });
}

/** The user whose e-mail and password match, or null; takes the same time either way. */
export async function authenticate(ds: DataSource, email: string, password: string): Promise<User | null> {
  const user = await ds.getRepository(User).findOneBy({ email });
  if (!user) {
    await burnPasswordCheck(password);
    return null;
  }
  return (await verifyPassword(password, user.passwordHash)) ? user : null;
}

/** The user's club memberships with their clubs, by club name. */
export async function listMemberships(ds: DataSource, userId: string): Promise<ClubMembership[]> {
  return ds.getRepository(ClubMembership).find({
    where: { userId },
    relations: { club: true },
    order: { club: { name: 'ASC' } },
  });
}
