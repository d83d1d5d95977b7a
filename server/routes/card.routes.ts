import { Router } from 'express'
import { z } from 'zod'
import type { AppContext } from '../context'
import { validate } from '../middleware/validate'
import { renderCard } from '../services/card.service'
import { cardFormatSchema, paperSchema } from '../../shared/schemas/card'

/** The resolutions served: a short fixed list, so anonymous requests cannot fill the render cache with every dpi. */
const SERVED_DPI = [100, 150, 300, 600]

const CONTENT_TYPES = { pdf: 'application/pdf', png: 'image/png', json: 'application/json' } as const

/** `GET /api/card/:paper.:format`: the scale card, public, so it can be printed before signing up. */
export function cardRoutes(_ctx: AppContext): Router {
  const r = Router()
  // The files depend only on paper, format and dpi: render each once per process.
  const cache = new Map<string, Promise<Buffer>>()
  r.get('/card/:paper.:format', validate({
    params: z.object({ paper: paperSchema, format: cardFormatSchema }),
    query: z.object({
      dpi: z.coerce.number().refine((v) => SERVED_DPI.includes(v), { message: `dpi must be one of ${SERVED_DPI.join(', ')}` }).optional(),
    }),
  }), async (req, res) => {
    const { paper, format } = req.params as unknown as { paper: 'a4' | 'letter'; format: 'pdf' | 'png' | 'json' }
    const { dpi } = req.query as { dpi?: number }
    const key = `${paper}.${format}.${dpi ?? ''}`
    if (!cache.has(key)) cache.set(key, renderCard(paper, format, { dpi }).catch((error: unknown) => {
      cache.delete(key)
      throw error
    }))
    const body = await cache.get(key)!
    const disposition = format === 'json' ? 'inline' : 'attachment'
    res.set({
      'Content-Type': CONTENT_TYPES[format],
      'Content-Disposition': `${disposition}; filename="rockerbook-scale-card-${paper}.${format}"`,
      'Cache-Control': 'public, max-age=86400',
    })
    res.send(body)
  })
  return r
}
