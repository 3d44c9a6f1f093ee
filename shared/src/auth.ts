import { z } from 'zod';
import { ROLES } from './roles';
import { isWellFormedText, oneLine } from './text';

/**
 * Password rules for every account outside the demo seed. bcrypt reads only the first 72 bytes
 * of a password (Provos and Mazières, "A Future-Adaptable Password Scheme", USENIX 1999), so a
 * longer one would be cut short without anyone knowing. The API also refuses passwords found on
 * a list of common passwords (NIST SP 800-63B section 5.1.1.2); that list is too large for the
 * browser, so the web form learns of it from the API's answer.
 */
export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_BYTES = 72;
const PASSWORD_MIN_DISTINCT = 5;

/** The password rule in one sentence, for the hint beside every password field. */
export const PASSWORD_RULE = `At least ${PASSWORD_MIN_LENGTH} characters and at most ${PASSWORD_MAX_BYTES} bytes, mixing letters with at least one digit or symbol; not a common password.`;

/** UTF-8 bytes, as bcrypt counts them. */
export function passwordBytes(password: string): number {
  return new TextEncoder().encode(password).length;
}

export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .refine(
    isWellFormedText,
    'This password has a broken character (half of an emoji or of another character written in two parts); type it again.',
  )
  .refine(
    (p) => passwordBytes(p) <= PASSWORD_MAX_BYTES,
    `Use at most ${PASSWORD_MAX_BYTES} bytes (${PASSWORD_MAX_BYTES} plain letters and digits; accented letters and emoji take more): a longer password would be cut short.`,
  )
  .refine((p) => !/[\p{Cc}]/u.test(p), 'Leave out control characters such as tabs and line breaks: they cannot be typed at sign-in.')
  .refine((p) => /[A-Za-z]/.test(p) && /[^A-Za-z]/.test(p), 'Mix letters with at least one digit or symbol.')
  .refine(
    (p) => new Set(p.toLowerCase()).size >= PASSWORD_MIN_DISTINCT,
    `Use at least ${PASSWORD_MIN_DISTINCT} different characters: one character over and over is guessed first.`,
  );

/** The users and sign_in_failures tables hold 254 characters, the longest address SMTP can carry (RFC 5321 section 4.5.3.1.3). */
export const EMAIL_MAX_LENGTH = 254;

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(EMAIL_MAX_LENGTH, `Use an email address of at most ${EMAIL_MAX_LENGTH} characters.`)
  .email('Enter an email address such as name@example.com.');

export const signInSchema = z.strictObject({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password.').max(200),
});
export type SignInRequest = z.infer<typeof signInSchema>;

export const roleSchema = z.enum(ROLES);

/** The header (or, where a header cannot be sent, the `kitchen` query parameter) naming the kitchen a request is for. */
export const KITCHEN_HEADER = 'x-crumbproof-kitchen';

/** A kitchen a person works in, with their role there. */
export const kitchenRoleSchema = z.object({
  /** The kitchen's number, sent back in KITCHEN_HEADER. */
  id: z.number().int(),
  /** Its id in the recipe book (null for the one kitchen of a book given as site). */
  code: z.string().nullable(),
  name: z.string(),
  role: roleSchema,
});
export type KitchenRole = z.infer<typeof kitchenRoleSchema>;

export const meSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  /** The person's role at `kitchen`; before any kitchen is set up, the role they were created with. */
  role: roleSchema,
  /**
   * The kitchen this answer is for: the one the request named, or the person's only one; null
   * when they work in several and named none (the app asks them to choose), or before any is set up.
   */
  kitchen: z.number().int().nullable(),
  /** Every kitchen the person has a role in, in the order they were set up. */
  kitchens: z.array(kitchenRoleSchema),
});
export type Me = z.infer<typeof meSchema>;

export const createUserSchema = z.strictObject({
  email: emailSchema,
  name: oneLine(z.string().trim().min(1, 'Enter the person’s name.').max(120)),
  role: roleSchema,
  password: passwordSchema,
});
export type CreateUserRequest = z.infer<typeof createUserSchema>;

export const updateUserSchema = z
  .strictObject({
    name: oneLine(z.string().trim().min(1, 'Enter the person’s name.').max(120)).optional(),
    role: roleSchema.optional(),
    active: z.boolean().optional(),
    password: passwordSchema.optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'Change at least one field.');
export type UpdateUserRequest = z.infer<typeof updateUserSchema>;

/**
 * A person as the users list shows them at one kitchen: `role` is their role there. invitationPending:
 * true for a user who was invited and has not chosen a password yet (they cannot sign in).
 */
export const userSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  active: z.boolean(),
  invitationPending: z.boolean(),
  createdAt: z.string(),
  /**
   * How many other kitchens the person works in. Their password and whether their account is
   * active are the account's, for every kitchen: only a manager at each of them may change those.
   */
  elsewhere: z.number().int().min(0).optional(),
});
export type User = z.infer<typeof userSchema>;

/**
 * The answer to adding someone (POST /api/users, POST /api/users/invitations): `created`, a new
 * account; `added`, an account that already works at another kitchen, given the role at this one
 * (it keeps its name and password, and no invitation is sent). `message` says which, in words.
 */
export const userAddedSchema = userSchema.extend({
  outcome: z.enum(['created', 'added']),
  message: z.string(),
});
export type UserAdded = z.infer<typeof userAddedSchema>;

/**
 * The answer to taking someone off the request's kitchen (DELETE /api/users/:id/kitchen): their
 * account stays, with their roles at other kitchens; `elsewhere` counts those.
 */
export const takenOffKitchenSchema = z.object({
  id: z.number().int(),
  kitchen: z.number().int(),
  elsewhere: z.number().int().min(0),
  message: z.string(),
});
export type TakenOffKitchen = z.infer<typeof takenOffKitchenSchema>;

/** Sets the first manager of a kitchen's own installation, with the one-time link printed at its first start. */
export const firstManagerSchema = z.strictObject({
  token: z.string().min(1, 'Open the link printed when Crumbproof first started.').max(200),
  email: emailSchema,
  name: oneLine(z.string().trim().min(1, 'Enter your name.').max(120)),
  password: passwordSchema,
});
export type FirstManagerRequest = z.infer<typeof firstManagerSchema>;

/** A manager adds someone by name, email and role; they get an invitation mail with a link to choose their password. */
export const inviteUserSchema = z.strictObject({
  email: emailSchema,
  name: oneLine(z.string().trim().min(1, 'Enter the person’s name.').max(120)),
  role: roleSchema,
});
export type InviteUserRequest = z.infer<typeof inviteUserSchema>;

/** "Forgot your password?": the answer is the same whether or not the address has an account. */
export const passwordResetRequestSchema = z.strictObject({ email: emailSchema });
export type PasswordResetRequest = z.infer<typeof passwordResetRequestSchema>;

/** The one-time token of a mailed link (base64url, 43 characters for its 32 random bytes). */
export const accountLinkTokenSchema = z
  .string()
  .min(1, 'Open the link in the mail you were sent.')
  .max(200, 'This is not the link from the mail: open it from the mail again.')
  .regex(/^[A-Za-z0-9_-]+$/, 'This is not the link from the mail: open it from the mail again.');

export const accountLinkCheckSchema = z.strictObject({ token: accountLinkTokenSchema });
export type AccountLinkCheckRequest = z.infer<typeof accountLinkCheckSchema>;

export const setPasswordSchema = z.strictObject({ token: accountLinkTokenSchema, password: passwordSchema });
export type SetPasswordRequest = z.infer<typeof setPasswordSchema>;

export type AccountLinkPurpose = 'invitation' | 'password-reset';

/**
 * What a mailed link is: usable (with whose account it opens), or why not in one word: used, expired,
 * replaced (a newer link was sent) or unknown (no such link, or its account is deactivated).
 */
export type AccountLinkState =
  | { state: 'usable'; purpose: AccountLinkPurpose; name: string; email: string; expiresAt: string }
  | { state: 'used' | 'expired' | 'replaced'; purpose: AccountLinkPurpose }
  | { state: 'unknown' };

/** The answer to a password reset request, the same for every address. */
export interface PasswordResetAnswer {
  message: string;
}
