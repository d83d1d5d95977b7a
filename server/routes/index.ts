import { Router } from 'express'
import type { AppContext } from '../context'
import { originCheck } from '../middleware/origin-check'
import { loadSession } from '../middleware/require-auth'
import { adminRoutes } from './admin.routes'
import { analysisRoutes } from './analysis.routes'
import { authRoutes } from './auth.routes'
import { bladeRoutes } from './blade.routes'
import { cardRoutes } from './card.routes'
import { devRoutes } from './dev.routes'
import { healthRoutes } from './health.routes'
import { historyRoutes } from './history.routes'
import { shareRoutes } from './share.routes'
import { shopRoutes } from './shop.routes'
import { skaterRoutes } from './skater.routes'
import { targetRoutes } from './target.routes'

/** Every `/api` router, in one list. A new resource adds its `<name>.routes.ts` here. */
export function apiRoutes(ctx: AppContext): Router {
  const api = Router()
  // Every state-changing call must come from the app's own origin; the session (if any) is read once for all routers.
  api.use(originCheck(ctx.config.PUBLIC_URL), loadSession(ctx))
  api.use(healthRoutes(ctx))
  api.use(authRoutes(ctx), skaterRoutes(ctx), shareRoutes(ctx), shopRoutes(ctx), adminRoutes(ctx))
  api.use(cardRoutes(ctx), bladeRoutes(ctx), analysisRoutes(ctx))
  api.use(targetRoutes(ctx), historyRoutes(ctx))
  const dev = devRoutes(ctx)
  if (dev) api.use(dev)
  return api
}
