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

export const meSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
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

export const userSchema = meSchema.extend({ active: z.boolean(), createdAt: z.string() });
export type User = z.infer<typeof userSchema>;

/** Sets the first manager of a kitchen's own installation, with the one-time link printed at its first start. */
export const firstManagerSchema = z.strictObject({
  token: z.string().min(1, 'Open the link printed when Crumbproof first started.').max(200),
  email: emailSchema,
  name: oneLine(z.string().trim().min(1, 'Enter your name.').max(120)),
  password: passwordSchema,
});
export type FirstManagerRequest = z.infer<typeof firstManagerSchema>;
