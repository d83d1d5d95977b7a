import { Router } from 'express'
import {
  changePasswordBodySchema,
  resetBodySchema,
  resetRequestBodySchema,
  sessionParamsSchema,
  signInBodySchema,
  signUpBodySchema,
  tokenBodySchema,
} from '../../shared/schemas/auth'
import type { AppContext } from '../context'
import { Account } from '../entities/account.entity'
import { createAuthLimiters } from '../middleware/rate-limits'
import { currentSession, requireAuth, signedIn } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import * as auth from '../services/auth.service'
import { authFor, clearSessionCookie, listSessions, revokeSession, startSession } from '../services/session.service'

/** Sign-up, sign-in/out, e-mail verification, password reset and change, and the caller's own sessions. */
export function authRoutes(ctx: AppContext): Router {
  const router = Router()
  const limits = createAuthLimiters()
  const client = (req: { get(h: string): string | undefined; ip?: string }) => ({ userAgent: req.get('user-agent'), ip: req.ip })
  /** A new sign-in replaces the browser's previous session rather than leaving it valid behind the new cookie. */
  const replaceSession = async (req: { session?: { id: string } }) => {
    if (req.session) await authFor(ctx).invalidateSession(req.session.id)
  }

  router.post('/auth/sign-up', ...limits.signUp, validate({ body: signUpBodySchema }), async (req, res) => {
    const account = await auth.signUp(ctx, req.body)
    await replaceSession(req)
    await startSession(ctx, res, account.id, client(req))
    res.status(201).json(auth.toMe(account))
  })

  router.post('/auth/sign-in', ...limits.signIn, validate({ body: signInBodySchema }), async (req, res) => {
    const account = await auth.authenticate(ctx, req.body.email, req.body.password)
    await replaceSession(req)
    await startSession(ctx, res, account.id, client(req))
    res.json(auth.toMe(account))
  })

  router.post('/auth/sign-out', async (req, res) => {
    if (req.session) await authFor(ctx).invalidateSession(req.session.id)
    clearSessionCookie(ctx, res)
    res.status(204).end()
  })

  router.get('/auth/me', requireAuth, (req, res) => {
    res.json(signedIn(req))
  })

  router.post('/auth/verify', validate({ body: tokenBodySchema }), async (req, res) => {
    await auth.verifyEmail(ctx, req.body.token)
    res.status(204).end()
  })

  router.post('/auth/verify/resend', requireAuth, async (req, res) => {
    await auth.sendVerification(ctx, await ctx.db.getRepository(Account).findOneByOrFail({ id: signedIn(req).id }))
    res.status(202).json({ sent: true })
  })

  router.post('/auth/reset-request', ...limits.reset, validate({ body: resetRequestBodySchema }), async (req, res) => {
    await auth.requestReset(ctx, req.body.email)
    res.status(202).json({ sent: true })
  })

  // The token names no account, so only the per-address limit applies to guessing it.
  router.post('/auth/reset', ...limits.reset.slice(0, 1), validate({ body: resetBodySchema }), async (req, res) => {
    await auth.resetPassword(ctx, req.body.token, req.body.password)
    res.status(204).end()
  })

  router.post('/auth/password', requireAuth, validate({ body: changePasswordBodySchema }), async (req, res) => {
    await auth.changePassword(ctx, signedIn(req).id, req.body.currentPassword, req.body.newPassword, currentSession(req).id)
    res.status(204).end()
  })

  router.get('/auth/sessions', requireAuth, async (req, res) => {
    res.json(await listSessions(ctx, signedIn(req), currentSession(req)))
  })

  router.delete('/auth/sessions/:id', requireAuth, validate({ params: sessionParamsSchema }), async (req, res) => {
    await revokeSession(ctx, signedIn(req), String(req.params.id))
    res.status(204).end()
  })

  return router
}
