import { z } from 'zod'

/**
 * Job names (noun.verb) and their payloads. Payloads carry ids only: the handler reloads the row, so a job that
 * runs twice or late still works from the current state.
 */
export const jobPayloads = {
  'mail.send': z.object({ outboxId: z.uuid() }).describe('A queued e-mail to deliver'),
  'photo.analyze': z.object({ analysisId: z.uuid() }).describe('A queued analysis of an uploaded blade photo'),
} as const

export type JobName = keyof typeof jobPayloads
export type JobPayload<N extends JobName> = z.infer<(typeof jobPayloads)[N]>
export const jobNames = Object.keys(jobPayloads) as JobName[]
