import { z } from 'zod'

/** Every role an account can hold; one account may hold several (a coach who also skates). */
export const roles = ['skater', 'coach', 'technician', 'shop_admin', 'admin'] as const
export const roleSchema = z.enum(roles)
export type Role = z.infer<typeof roleSchema>

/** Lower-cased and trimmed, so one address is one account whatever its spelling. */
export const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .min(1, 'Enter your e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.com.' }))
  .transform((s) => s.toLowerCase())

/** Length is what makes a password strong; no composition rules. Long passphrases are fine. */
export const passwordSchema = z
  .string({ error: 'Enter a password.' })
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.')

export const personNameSchema = z
  .string({ error: 'Enter your name.' })
  .trim()
  .min(1, 'Enter your name.')
  .max(100, 'Use at most 100 characters.')

export const signUpBodySchema = z.object({
  email: emailSchema,
  password: passwordSchema,
  name: personNameSchema,
  skates: z.boolean().default(true).describe('Skates, or manages skaters (a parent); grants the skater role'),
  coaches: z.boolean().default(false).describe('Coaches skaters; grants the coach role'),
})
export type SignUpBody = z.input<typeof signUpBodySchema>

/** Sign-in checks only that something was typed: the rules of the day may be stricter than when it was set. */
export const signInBodySchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200),
})
export type SignInBody = z.input<typeof signInBodySchema>

export const tokenBodySchema = z.object({ token: z.string().min(20, 'This link is incomplete.').max(200) })

export const resetRequestBodySchema = z.object({ email: emailSchema })

export const resetBodySchema = z.object({
  token: z.string().min(20, 'This link is incomplete.').max(200),
  password: passwordSchema,
})

export const changePasswordBodySchema = z.object({
  currentPassword: z.string().min(1, 'Enter your current password.').max(200),
  newPassword: passwordSchema,
})

/** The signed-in person as `GET /api/auth/me` answers. */
export const meSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  roles: z.array(roleSchema),
  emailVerified: z.boolean(),
})
export type Me = z.infer<typeof meSchema>

/** One of the caller's own sessions. `id` is a handle derived from the session, never the cookie value itself. */
export const sessionInfoSchema = z.object({
  id: z.string(),
  createdAt: z.iso.datetime(),
  expiresAt: z.iso.datetime(),
  userAgent: z.string().nullable(),
  ip: z.string().nullable(),
  current: z.boolean(),
})
export type SessionInfo = z.infer<typeof sessionInfoSchema>

export const sessionParamsSchema = z.object({ id: z.string().regex(/^[0-9a-f]{32}$/, 'Unknown session.') })
