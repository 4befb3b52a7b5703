// Sign-in and join: the same schemas validate the client's forms and the server's bodies.
import { z } from 'zod';
import { roleSchema } from './case-status-schemas';

// OWASP ASVS 6.2.1 / 6.2.9: at least 8 characters, at least 64 allowed. We allow up to 128.
export const PASSWORD_MIN = 8;
export const PASSWORD_MAX = 128;

export const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'That does not look like an e-mail address.' }));

export const passwordSchema = z
  .string({ error: 'Enter a password.' })
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters.`)
  .max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters.`);

export const displayNameSchema = z
  .string({ error: 'Tell us what to call you.' })
  .trim()
  .min(1, 'Tell us what to call you.')
  .max(60, 'Keep your name under 60 characters.');

export const registerSchema = z.object({
  email: emailSchema,
  password: passwordSchema,
  displayName: displayNameSchema,
});

/** PATCH /api/auth/me: what the signed-in person may change about themselves here. */
export const accountPatchSchema = z.object({ displayName: displayNameSchema });

/** POST /api/auth/password: the current password, then the new one. */
export const passwordChangeSchema = z.object({
  currentPassword: z.string({ error: 'Enter your current password.' }).min(1, 'Enter your current password.').max(PASSWORD_MAX),
  password: passwordSchema,
});
export type PasswordChangeInput = z.infer<typeof passwordChangeSchema>;
export type RegisterInput = z.infer<typeof registerSchema>;

export const loginSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(PASSWORD_MAX),
});
export type LoginInput = z.infer<typeof loginSchema>;

export const publicUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  displayName: z.string(),
  role: roleSchema,
  emailVerified: z.boolean(),
});
export type PublicUser = z.infer<typeof publicUserSchema>;

export interface ApiErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}
