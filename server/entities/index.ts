import { Club } from './club.js';
import { ClubMembership } from './club-membership.js';
import { Livestock } from './livestock.js';
import { PasswordResetToken } from './password-reset-token.js';
import { Plan } from './plan.js';
import { Reading } from './reading.js';
import { SignInFailure } from './sign-in-failure.js';
import { Tank } from './tank.js';
import { User } from './user.js';

export { Club, ClubMembership, Livestock, PasswordResetToken, Plan, Reading, SignInFailure, Tank, User };

/** Listed as classes (not globs) so tsx, compiled JS and vitest load the same set. */
export const entities = [User, PasswordResetToken, Club, ClubMembership, Tank, Livestock, Reading, Plan, SignInFailure];
