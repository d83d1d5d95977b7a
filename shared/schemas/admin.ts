import { z } from 'zod'
import { roleSchema } from './auth'

export const adminUserQuerySchema = z.object({
  q: z.string().trim().max(100).optional().describe('Matches name or e-mail, case-insensitive'),
})

export const adminUserSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  roles: z.array(roleSchema),
  emailVerified: z.boolean(),
  disabled: z.boolean(),
  createdAt: z.iso.datetime(),
})
export type AdminUser = z.infer<typeof adminUserSchema>

export const adminUpdateUserBodySchema = z
  .object({
    roles: z.array(roleSchema).max(5).optional(),
    disabled: z.boolean().optional(),
  })
  .refine((b) => b.roles !== undefined || b.disabled !== undefined, { message: 'Change roles or disabled.' })
