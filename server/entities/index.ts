import { ClubInvite } from './club-invite.js';
import { ClubShare } from './club-share.js';
import { Lesson } from './lesson.js';
import { MailSend } from './mail-send.js';
import { PlanComment } from './plan-comment.js';
import { ReminderOptOut } from './reminder-opt-out.js';
import { ShareLink } from './share-link.js';
import { Club } from './club.js';
import { ClubMembership } from './club-membership.js';
import { Livestock } from './livestock.js';
import { PasswordResetToken } from './password-reset-token.js';
import { Plan } from './plan.js';
import { Reading } from './reading.js';
import { SignInFailure } from './sign-in-failure.js';
import { Tank } from './tank.js';
import { TankFit } from './tank-fit.js';
import { User } from './user.js';
import { UserPreferences } from './user-preferences.js';

export { Club, ClubMembership, Livestock, PasswordResetToken, Plan, Reading, SignInFailure, Tank, User };
export { TankFit, UserPreferences };
export { ClubInvite, ClubShare, Lesson, MailSend, PlanComment, ReminderOptOut, ShareLink };

/** Listed as classes (not globs) so tsx, compiled JS and vitest load the same set. */
export const entities = [User, PasswordResetToken, Club, ClubMembership, Tank, Livestock, Reading, Plan, SignInFailure, ClubInvite, ClubShare, PlanComment, Lesson, ShareLink, MailSend, ReminderOptOut, UserPreferences, TankFit];
