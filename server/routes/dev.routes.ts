import { Router } from 'express'
import type { AppContext } from '../context'
import { listCapturedMail } from '../services/dev-mailbox.service'

/**
 * Development-only helpers. Mounted only while the app runs on its embedded SMTP fake (DEV_MAILBOX_DIR set and not
 * production), so a deployment with a real relay has no such routes at all.
 */
export function devRoutes(ctx: AppContext): Router | null {
  const dir = ctx.config.DEV_MAILBOX_DIR
  if (!dir || ctx.config.NODE_ENV === 'production') return null
  const router = Router()
  router.get('/dev/mail', async (_req, res) => {
    res.json(await listCapturedMail(dir))
  })
  return router
}
