import { z } from 'zod'

export const serviceHealthSchema = z.object({
  status: z.enum(['up', 'down']),
  latencyMs: z.number().describe('Round-trip time of the check in milliseconds'),
  message: z.string().optional().describe('Why the service is down'),
})

/** Answer of `GET /api/health`: 200 when every service is up, 503 otherwise. */
export const healthSchema = z.object({
  status: z.enum(['up', 'down']),
  services: z.object({
    database: serviceHealthSchema,
    storage: serviceHealthSchema,
    mail: serviceHealthSchema,
    queue: serviceHealthSchema,
  }),
})

export type ServiceHealth = z.infer<typeof serviceHealthSchema>
export type Health = z.infer<typeof healthSchema>
