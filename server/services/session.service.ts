import { createHash } from 'node:crypto'
import type { Response } from 'express'
import { Lucia, TimeSpan, type Session, type User } from 'lucia'
import type { SessionInfo } from '../../shared/schemas/auth'
import type { AppContext } from '../context'
import { NotFoundError } from '../errors'
import { TypeOrmLuciaAdapter } from './lucia-adapter'

export const SESSION_COOKIE = 'rb_session'

const instances = new WeakMap<AppContext['db'], Map<boolean, Lucia>>()

/** One lucia per database and scheme: httpOnly, SameSite=Lax cookie, Secure whenever the public URL is https. */
export function authFor(ctx: Pick<AppContext, 'db' | 'config'>): Lucia {
  const secure = new URL(ctx.config.PUBLIC_URL).protocol === 'https:'
  const perDb = instances.get(ctx.db) ?? new Map<boolean, Lucia>()
  instances.set(ctx.db, perDb)
  let lucia = perDb.get(secure)
  if (!lucia) {
    lucia = new Lucia(new TypeOrmLuciaAdapter(ctx.db), {
      sessionExpiresIn: new TimeSpan(30, 'd'),
      sessionCookie: { name: SESSION_COOKIE, attributes: { secure, sameSite: 'lax' } },
      getUserAttributes: (a) => a,
      getSessionAttributes: (a) => a,
    })
    perDb.set(secure, lucia)
  }
  return lucia
}

export async function startSession(
  ctx: Pick<AppContext, 'db' | 'config'>,
  res: Response,
  accountId: string,
  client: { userAgent?: string; ip?: string },
): Promise<Session> {
  const lucia = authFor(ctx)
  const session = await lucia.createSession(accountId, {
    userAgent: client.userAgent?.slice(0, 300) ?? null,
    ip: client.ip ?? null,
    createdAt: new Date(),
  })
  res.append('Set-Cookie', lucia.createSessionCookie(session.id).serialize())
  return session
}

export function clearSessionCookie(ctx: Pick<AppContext, 'db' | 'config'>, res: Response): void {
  res.append('Set-Cookie', authFor(ctx).createBlankSessionCookie().serialize())
}

export async function resolveSession(ctx: Pick<AppContext, 'db' | 'config'>, cookieHeader: string | undefined) {
  const lucia = authFor(ctx)
  const id = cookieHeader ? lucia.readSessionCookie(cookieHeader) : null
  if (!id) return { session: null, user: null } as { session: null; user: null }
  return lucia.validateSession(id)
}

/** The handle a session is listed and revoked by: a digest, so the cookie value itself never travels in a body. */
export function sessionHandle(sessionId: string): string {
  return createHash('sha256').update(sessionId).digest('hex').slice(0, 32)
}

export async function listSessions(ctx: Pick<AppContext, 'db' | 'config'>, user: User, current: Session): Promise<SessionInfo[]> {
  const sessions = await authFor(ctx).getUserSessions(user.id)
  return sessions.map((s) => ({
    id: sessionHandle(s.id),
    createdAt: s.createdAt.toISOString(),
    expiresAt: s.expiresAt.toISOString(),
    userAgent: s.userAgent,
    ip: s.ip,
    current: s.id === current.id,
  }))
}

/** Ends one of the caller's own sessions; another person's handle is simply not found. */
export async function revokeSession(ctx: Pick<AppContext, 'db' | 'config'>, user: User, handle: string): Promise<void> {
  const lucia = authFor(ctx)
  const sessions = await lucia.getUserSessions(user.id)
  const target = sessions.find((s) => sessionHandle(s.id) === handle)
  if (!target) throw new NotFoundError('That session')
  await lucia.invalidateSession(target.id)
}

export function endAllSessions(ctx: Pick<AppContext, 'db' | 'config'>, accountId: string): Promise<void> {
  return authFor(ctx).invalidateUserSessions(accountId)
}
