import { Router } from 'express'
import type { AppContext } from '../context'
import { devRoutes } from './dev.routes'
import { healthRoutes } from './health.routes'

/** Every `/api` router, in one list. A new resource adds its `<name>.routes.ts` here. */
export function apiRoutes(ctx: AppContext): Router {
  const api = Router()
  api.use(healthRoutes(ctx))
  const dev = devRoutes(ctx)
  if (dev) api.use(dev)
  return api
}
