import { z } from 'zod';
import { ROLES } from '../auth/roles';

/**
 * The one spelling of an e-mail address: Unicode NFKC (a full-width or no-break character becomes its plain
 * form), trimmed, lower case. Sign-in, its limiter and people management all key on this.
 */
export const normaliseEmail = (email: string) => email.normalize('NFKC').trim().toLowerCase();
export const emailSchema = z.string().overwrite(normaliseEmail).email('must be an e-mail address').max(254);
export const passwordSchema = z.string().min(12, 'must have at least 12 characters').max(200);
export const roleSchema = z.enum(ROLES);

export const signInBody = z.object({
  email: emailSchema,
  password: z.string().min(1, 'is required').max(200),
});
export type SignInBody = z.infer<typeof signInBody>;

export const createPersonBody = z.object({
  email: emailSchema,
  name: z.string().trim().min(1, 'is required').max(120),
  roles: z.array(roleSchema).min(1, 'give at least one role'),
  password: passwordSchema,
});
export type CreatePersonBody = z.infer<typeof createPersonBody>;

export const updatePersonBody = z
  .object({
    name: z.string().trim().min(1).max(120).optional(),
    roles: z.array(roleSchema).min(1, 'give at least one role').optional(),
    active: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'give at least one of name, roles, active' });
export type UpdatePersonBody = z.infer<typeof updatePersonBody>;

export const changePasswordBody = z.object({
  currentPassword: z.string().min(1, 'is required'),
  newPassword: passwordSchema,
});

/** The signed-in user as the API shows it (never a hash or a session id). */
export const meSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  roles: z.array(roleSchema),
});
export type Me = z.infer<typeof meSchema>;
