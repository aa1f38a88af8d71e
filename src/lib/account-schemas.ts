import { z } from 'zod';
import { ROLES } from './roles';

/**
 * One schema per thing, shared by the browser forms and the endpoints that receive them.
 */

export const MIN_PASSWORD_LENGTH = 12;

// A short list of the passwords people reach for first; length alone lets these through.
const COMMON_PASSWORDS = new Set([
  'password1234',
  'passwordpassword',
  '123456789012',
  'qwertyuiopas',
  'letmeinletmein',
  'iloveyou1234',
  'administrator',
]);

export const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .max(254, 'An e-mail address has at most 254 characters.')
  .pipe(z.email({ error: 'Enter an e-mail address such as name@example.com.' }));

export const passwordSchema = z
  .string({ error: 'Enter a password.' })
  .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters; a short sentence works well.`)
  .max(200, 'Use at most 200 characters.')
  .refine((value) => new Set(value).size > 3, 'Use more than three different characters.')
  .refine((value) => !COMMON_PASSWORDS.has(value.toLowerCase()), 'That password is too common; choose another.');

export const personNameSchema = z
  .string({ error: 'Enter your name.' })
  .trim()
  .min(1, 'Enter your name.')
  .max(100, 'Use at most 100 characters.');

export const signUpSchema = z.object({ email: emailSchema, password: passwordSchema, name: personNameSchema });
export type SignUpInput = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200),
});

export const teamNameSchema = z
  .string({ error: 'Enter the team name.' })
  .trim()
  .min(2, 'Use at least 2 characters.')
  .max(80, 'Use at most 80 characters.');

export const createTeamSchema = z.object({ name: teamNameSchema });

export const roleSchema = z.enum(ROLES, { error: `Choose one of: ${ROLES.join(', ')}.` });

export const invitationSchema = z.object({ email: emailSchema, role: roleSchema });
export const memberRoleSchema = z.object({ role: roleSchema });
export const switchTeamSchema = z.object({ teamId: z.string({ error: 'Choose a team.' }).min(1, 'Choose a team.') });

// A person reads torque in lbf·in or N·m; lbf·ft exists for conversions of bolt torques only.
const READER_LENGTH_UNITS = ['in', 'mm'] as const;
const READER_TORQUE_UNITS = ['lbf-in', 'N-m'] as const;

export const accountSettingsSchema = z.object({
  name: personNameSchema.optional(),
  lengthUnit: z.enum(READER_LENGTH_UNITS, { error: 'Choose in or mm.' }).optional(),
  torqueUnit: z.enum(READER_TORQUE_UNITS, { error: 'Choose lbf-in or N-m.' }).optional(),
});

export const passwordChangeSchema = z.object({
  currentPassword: z.string({ error: 'Enter your current password.' }).min(1, 'Enter your current password.'),
  newPassword: passwordSchema,
});

export const acceptInvitationSchema = z.object({
  token: z
    .string({ error: 'The invitation link is incomplete.' })
    .min(20, 'The invitation link is incomplete.')
    .max(200),
});

/** Asking for a mailed link (a password reset, or the verification link again): the address only. */
export const mailLinkRequestSchema = z.object({ email: emailSchema });

const mailedTokenSchema = z
  .string({ error: 'The link is incomplete; open it from the mail again.' })
  .min(20, 'The link is incomplete; open it from the mail again.')
  .max(200, 'The link is incomplete; open it from the mail again.');

export const addressConfirmationSchema = z.object({ token: mailedTokenSchema });

export const passwordResetSchema = z.object({ token: mailedTokenSchema, newPassword: passwordSchema });
