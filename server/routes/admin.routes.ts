import { Router } from 'express'
import { adminUpdateUserBodySchema, adminUserQuerySchema } from '../../shared/schemas/admin'
import { idParamsSchema } from '../../shared/schemas/sharing'
import type { AppContext } from '../context'
import { requireAuth, requireRole, signedIn } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import * as admin from '../services/admin.service'
import { routeRoles } from '../services/policy'

/** The platform admin's users table: search, roles, disabling. */
export function adminRoutes(ctx: AppContext): Router {
  const router = Router()
  const onlyAdmins = [requireAuth, requireRole(...routeRoles.admin)]

  router.get('/admin/users', ...onlyAdmins, validate({ query: adminUserQuerySchema }), async (req, res) => {
    res.json(await admin.searchUsers(ctx, (req.query as { q?: string }).q))
  })

  router.patch('/admin/users/:id', ...onlyAdmins, validate({ params: idParamsSchema, body: adminUpdateUserBodySchema }), async (req, res) => {
    res.json(await admin.updateUser(ctx, signedIn(req), String(req.params.id), req.body))
  })

  return router
}
