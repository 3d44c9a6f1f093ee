import { z } from 'zod';
import { ROLES } from './roles';

/** Password rules for every account outside the demo seed. */
export const PASSWORD_MIN_LENGTH = 12;
export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .max(200, 'Use at most 200 characters.')
  .refine((p) => /[A-Za-z]/.test(p) && /[^A-Za-z]/.test(p), 'Mix letters with at least one digit or symbol.');

export const emailSchema = z.string().trim().toLowerCase().email('Enter an email address such as name@example.com.');

export const signInSchema = z.object({
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

export const createUserSchema = z.object({
  email: emailSchema,
  name: z.string().trim().min(1, 'Enter the person’s name.').max(120),
  role: roleSchema,
  password: passwordSchema,
});
export type CreateUserRequest = z.infer<typeof createUserSchema>;

export const updateUserSchema = z
  .object({
    name: z.string().trim().min(1, 'Enter the person’s name.').max(120).optional(),
    role: roleSchema.optional(),
    active: z.boolean().optional(),
    password: passwordSchema.optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'Change at least one field.');
export type UpdateUserRequest = z.infer<typeof updateUserSchema>;

export const userSchema = meSchema.extend({ active: z.boolean(), createdAt: z.string() });
export type User = z.infer<typeof userSchema>;
