import { z } from 'zod'

/** One blade that needs someone's eyes, and why (most urgent reason first). */
export const attentionItemSchema = z.object({
  bladeId: z.uuid(),
  pairId: z.uuid(),
  skaterId: z.uuid(),
  skater: z.string(),
  pair: z.string(),
  side: z.enum(['left', 'right']),
  level: z.number().int().min(1).max(3).describe('3 replace, 2 off target or re-profile, 1 near a limit or coming up'),
  reasons: z.array(z.string()).min(1),
  lastMeasuredAt: z.string().nullable(),
})

export type AttentionItem = z.infer<typeof attentionItemSchema>
