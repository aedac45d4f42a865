import bcrypt from 'bcrypt';

/** bcrypt work factor; OWASP Password Storage cheat sheet asks for at least 10, ASVS L2 for 12 here. */
export const BCRYPT_COST = 12;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

let dummyHash: Promise<string> | undefined;

/**
 * Compares against a throw-away hash when no account has the e-mail, so a wrong e-mail takes
 * as long as a wrong password and the response time does not reveal which accounts exist.
 */
export async function burnPasswordCheck(password: string): Promise<void> {
  dummyHash ??= bcrypt.hash('shoalshift-timing-equaliser', BCRYPT_COST);
  await bcrypt.compare(password, await dummyHash);
}
