import { Router } from 'express'
import type { AppContext } from '../context'
import { checkHealth } from '../services/health.service'

/** `GET /api/health`: public, for load balancers and the home page; 503 when any backing service is down. */
export function healthRoutes(ctx: AppContext): Router {
  const router = Router()
  router.get('/health', async (_req, res) => {
    const report = await checkHealth(ctx)
    res.status(report.status === 'up' ? 200 : 503).json(report)
  })
  return router
}
