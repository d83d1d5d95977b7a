import { z } from 'zod'

/** A message captured by the local SMTP fake, as `GET /api/dev/mail` lists it (newest first). */
export const devMailSchema = z.object({
  id: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  links: z.array(z.string()).describe('Every http(s) link found in the plain-text part, in order'),
  receivedAt: z.iso.datetime(),
})

export type DevMail = z.infer<typeof devMailSchema>
