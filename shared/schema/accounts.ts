import { z } from 'zod';

/** Account roles: new sign-ups are members. */
export const roles = ['admin', 'instructor', 'member'] as const;
export type Role = (typeof roles)[number];

/** Limits on a password (characters). No composition rules (NIST SP 800-63B §5.1.1.2). */
export const PASSWORD_MIN = 8;
export const PASSWORD_MAX = 256;

/** An e-mail address, trimmed and lower-cased so that one person has one account. */
export const emailField = z
  .string()
  .trim()
  .toLowerCase()
  .max(254)
  .pipe(z.email({ message: 'not an e-mail address' }));

export const passwordField = z
  .string()
  .min(PASSWORD_MIN, `must be at least ${PASSWORD_MIN} characters`)
  .max(PASSWORD_MAX, `must be at most ${PASSWORD_MAX} characters`);

export const signupBody = z.strictObject({
  email: emailField,
  password: passwordField,
  name: z.string().trim().min(1, 'must not be empty').max(120),
});

/** The token of a sign-up link (a sealed pending account, a few hundred characters). */
export const signupConfirmBody = z.strictObject({ token: z.string().min(1).max(4000) });

export const loginBody = z.strictObject({
  email: emailField,
  // Any length is checked against the hash, but an absurd one is refused before hashing.
  password: z.string().min(1, 'must not be empty').max(PASSWORD_MAX),
});

export const resetRequestBody = z.strictObject({ email: emailField });

export const resetBody = z.strictObject({
  token: z.string().min(1).max(200),
  password: passwordField,
});

export const adminUserPatch = z
  .strictObject({
    role: z.enum(roles).optional(),
    disabled: z.boolean().optional(),
  })
  .refine((p) => p.role !== undefined || p.disabled !== undefined, { message: 'give role or disabled' });
