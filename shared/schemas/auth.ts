import { z } from 'zod';

/** bcrypt reads at most 72 bytes of a password; longer ones are refused, not truncated. */
export const PASSWORD_MAX_BYTES = 72;
export const PASSWORD_MIN_LENGTH = 8;

const utf8Bytes = (s: string) => new TextEncoder().encode(s).length;

export const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.org.' }));

export const passwordSchema = z
  .string({ error: 'Enter a password.' })
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .refine((s) => utf8Bytes(s) <= PASSWORD_MAX_BYTES, {
    message: `Use at most ${PASSWORD_MAX_BYTES} bytes (about ${PASSWORD_MAX_BYTES} plain letters; accented letters and emoji count double or more).`,
  });

export const displayNameSchema = z
  .string({ error: 'Enter a name.' })
  .trim()
  .min(1, 'Enter a name.')
  .max(80, 'Use at most 80 characters.');

export const signUpSchema = z.strictObject({
  email: emailSchema,
  password: passwordSchema,
  displayName: displayNameSchema,
});
export type SignUpInput = z.infer<typeof signUpSchema>;

/** What a sign-up answers (202), whether or not the address has an account. */
export const signUpSentSchema = z.object({ message: z.string() });
export type SignUpSent = z.infer<typeof signUpSentSchema>;

/** The token from the e-mailed link that finishes a sign-up (`/confirm-sign-up?token=`). */
export const confirmSignUpSchema = z.strictObject({
  token: z.string({ error: 'This sign-up link is not valid.' }).min(20, 'This sign-up link is not valid.').max(200, 'This sign-up link is not valid.'),
});
export type ConfirmSignUpInput = z.infer<typeof confirmSignUpSchema>;

export const signInSchema = z.strictObject({
  email: emailSchema,
  // Sign-in only checks presence: the length rules apply when a password is chosen.
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(1024, 'Too long.'),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const forgotPasswordSchema = z.strictObject({ email: emailSchema });
export type ForgotPasswordInput = z.infer<typeof forgotPasswordSchema>;

export const resetPasswordSchema = z.strictObject({
  token: z.string().min(20, 'This reset link is not valid.').max(200, 'This reset link is not valid.'),
  password: passwordSchema,
});
export type ResetPasswordInput = z.infer<typeof resetPasswordSchema>;

export const siteRoleSchema = z.enum(['user', 'admin']);
export type SiteRole = z.infer<typeof siteRoleSchema>;
export const clubRoleSchema = z.enum(['organizer', 'mentor', 'member']);
export type ClubRole = z.infer<typeof clubRoleSchema>;

/** What `/api/me`, a successful sign-in and a confirmed sign-up answer. */
export const meSchema = z.object({
  id: z.string().uuid(),
  email: z.string(),
  displayName: z.string(),
  role: siteRoleSchema,
  clubs: z.array(z.object({ id: z.string().uuid(), name: z.string(), role: clubRoleSchema })),
});
export type Me = z.infer<typeof meSchema>;
