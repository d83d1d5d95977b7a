import type { Request, RequestHandler } from 'express'
import type { Session } from 'lucia'
import type { Role } from '../../shared/schemas/auth'
import type { AppContext } from '../context'
import { ForbiddenError, UnauthorizedError } from '../errors'
import { authFor, resolveSession, SESSION_COOKIE } from '../services/session.service'

/** The signed-in person as every route and service sees them. */
export interface AuthUser {
  id: string
  email: string
  name: string
  roles: Role[]
  emailVerified: boolean
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Set for a request with a valid session cookie (see `loadSession`); `requireAuth` guarantees it. */
      user?: AuthUser
      session?: Session
    }
  }
}

/**
 * Reads the session cookie once per API request. An invalid or expired cookie is cleared; a session past half its
 * life is extended and its cookie re-sent. Requests without a cookie cost nothing.
 */
export function loadSession(ctx: Pick<AppContext, 'db' | 'config'>): RequestHandler {
  return async (req, res, next) => {
    const header = req.headers.cookie
    if (!header || !header.includes(`${SESSION_COOKIE}=`)) return next()
    const { session, user } = await resolveSession(ctx, header)
    const lucia = authFor(ctx)
    if (!session) {
      res.append('Set-Cookie', lucia.createBlankSessionCookie().serialize())
      return next()
    }
    if (session.fresh) res.append('Set-Cookie', lucia.createSessionCookie(session.id).serialize())
    req.session = session
    req.user = { id: user.id, email: user.email, name: user.name, roles: user.roles, emailVerified: user.emailVerified }
    next()
  }
}

/** 401 unless the request carries a valid session. */
export const requireAuth: RequestHandler = (req, _res, next) => {
  if (!req.user || !req.session) throw new UnauthorizedError()
  next()
}

/** 403 unless the signed-in account holds at least one of the roles. Put after `requireAuth`. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    const user = signedIn(req)
    if (!roles.some((r) => user.roles.includes(r))) throw new ForbiddenError('Your account does not have the role this needs.')
    next()
  }
}

/** 403 EMAIL_NOT_VERIFIED until the account has confirmed its address. Put after `requireAuth`. */
export const requireVerified: RequestHandler = (req, _res, next) => {
  if (!signedIn(req).emailVerified) {
    throw new ForbiddenError('Confirm your e-mail address first: open the link we sent you.', 'EMAIL_NOT_VERIFIED')
  }
  next()
}

/** The signed-in user of a request that passed `requireAuth`. */
export function signedIn(req: Request): AuthUser {
  if (!req.user) throw new UnauthorizedError()
  return req.user
}

export function currentSession(req: Request): Session {
  if (!req.session) throw new UnauthorizedError()
  return req.session
}
