import type { Router } from 'express'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { adminRoutes } from '../../server/routes/admin.routes'
import { authRoutes } from '../../server/routes/auth.routes'
import { shareRoutes } from '../../server/routes/share.routes'
import { shopRoutes } from '../../server/routes/shop.routes'
import { skaterRoutes } from '../../server/routes/skater.routes'
import { issueToken } from '../../server/services/email-token.service'
import { sessionHandle, authFor } from '../../server/services/session.service'
import { TEST_PASSWORD, appOrigin, uniqueEmail } from '../support/accounts'
import { buildWorld, callerNames, cookieFor, fresh, SKATER_NAME, strangers, type CallerName, type World } from '../support/matrix-world'
import { createTestContext } from '../support/test-context'

type Ctx = Awaited<ReturnType<typeof createTestContext>>
type Expect = Partial<Record<CallerName, number>> & { rest: number }

interface RouteCase {
  route: string
  /** Builds the concrete path and body, creating a throwaway row where the call would change shared state. */
  call(ctx: Ctx, w: World, caller: CallerName): Promise<{ path: string; body?: unknown }>
  expect: Expect
}

const signedIn = (status: number): Expect => ({ anonymous: 401, rest: status })
/** The skater's owner, its coach and its shop's people reach it; everyone else gets the same 404 as for no skater. */
const reader = { owner: 200, coach: 200, technician: 200, shopAdmin: 200, anonymous: 401, rest: 404 }
const same = (path: string) => async () => ({ path })

const cases: RouteCase[] = [
  { route: 'POST /auth/sign-up', call: async () => ({ path: '/auth/sign-up', body: { email: uniqueEmail('matrix-up'), password: TEST_PASSWORD, name: 'M' } }), expect: { rest: 201 } },
  { route: 'POST /auth/sign-in', call: async (_c, w) => ({ path: '/auth/sign-in', body: { email: w.emails.owner, password: TEST_PASSWORD } }), expect: { rest: 200 } },
  { route: 'POST /auth/sign-out', call: same('/auth/sign-out'), expect: { rest: 204 } },
  { route: 'GET /auth/me', call: same('/auth/me'), expect: signedIn(200) },
  {
    route: 'POST /auth/verify',
    call: async (ctx, w) => ({ path: '/auth/verify', body: { token: await issueToken(ctx, w.spareAccountId, 'verify') } }),
    expect: { rest: 204 },
  },
  { route: 'POST /auth/verify/resend', call: same('/auth/verify/resend'), expect: { anonymous: 401, unverified: 202, rest: 409 } },
  { route: 'POST /auth/reset-request', call: async () => ({ path: '/auth/reset-request', body: { email: uniqueEmail('matrix-reset') } }), expect: { rest: 202 } },
  {
    route: 'POST /auth/reset',
    call: async (ctx, w) => ({ path: '/auth/reset', body: { token: await issueToken(ctx, w.spareAccountId, 'reset'), password: TEST_PASSWORD } }),
    expect: { rest: 204 },
  },
  { route: 'POST /auth/password', call: async () => ({ path: '/auth/password', body: { currentPassword: TEST_PASSWORD, newPassword: TEST_PASSWORD } }), expect: signedIn(204) },
  { route: 'GET /auth/sessions', call: same('/auth/sessions'), expect: signedIn(200) },
  {
    route: 'DELETE /auth/sessions/:id',
    call: async (ctx, w) => {
      const s = await authFor(ctx).createSession(w.ids.owner, { userAgent: 'victim', ip: null, createdAt: new Date() })
      return { path: `/auth/sessions/${sessionHandle(s.id)}` }
    },
    expect: { owner: 204, anonymous: 401, rest: 404 },
  },
  { route: 'POST /skaters', call: async () => ({ path: '/skaters', body: { name: 'New' } }), expect: { owner: 201, otherSkater: 201, unverified: 201, anonymous: 401, rest: 403 } },
  { route: 'GET /skaters', call: same('/skaters'), expect: signedIn(200) },
  { route: 'GET /skaters/:id', call: async (_c, w) => ({ path: `/skaters/${w.skaterId}` }), expect: reader },
  { route: 'PATCH /skaters/:id', call: async (_c, w) => ({ path: `/skaters/${w.skaterId}`, body: { name: SKATER_NAME } }), expect: { owner: 200, anonymous: 401, rest: 404 } },
  { route: 'GET /roster', call: same('/roster'), expect: { coach: 200, otherCoach: 200, anonymous: 401, rest: 403 } },
  { route: 'GET /shares', call: same('/shares'), expect: signedIn(200) },
  { route: 'GET /skaters/:id/shares', call: async (_c, w) => ({ path: `/skaters/${w.skaterId}/shares` }), expect: { owner: 200, anonymous: 401, rest: 404 } },
  {
    route: 'POST /skaters/:id/shares/coach',
    call: async (_c, w) => ({ path: `/skaters/${w.skaterId}/shares/coach`, body: { email: uniqueEmail('invitee') } }),
    expect: { owner: 201, unverified: 403, anonymous: 401, rest: 404 },
  },
  {
    route: 'POST /skaters/:id/shares/shop',
    call: async (ctx, w) => ({ path: `/skaters/${w.skaterId}/shares/shop`, body: { shopId: await fresh.shop(ctx) } }),
    expect: { owner: 201, unverified: 403, anonymous: 401, rest: 404 },
  },
  {
    route: 'POST /shares/:id/accept',
    call: async (ctx, w) => ({ path: `/shares/${await fresh.share(ctx, w, 'pending')}/accept` }),
    expect: { coach: 200, otherCoach: 404, anonymous: 401, rest: 403 },
  },
  {
    route: 'DELETE /shares/:id',
    call: async (ctx, w) => ({ path: `/shares/${await fresh.share(ctx, w, 'active')}` }),
    expect: { owner: 204, coach: 204, anonymous: 401, rest: 404 },
  },
  { route: 'GET /shops', call: same('/shops'), expect: signedIn(200) },
  { route: 'GET /shops/:id/members', call: async (_c, w) => ({ path: `/shops/${w.shopId}/members` }), expect: { technician: 200, shopAdmin: 200, anonymous: 401, rest: 404 } },
  {
    route: 'DELETE /shops/:id/members/:accountId',
    call: async (ctx, w) => ({ path: `/shops/${w.shopId}/members/${await fresh.technician(ctx, w)}` }),
    expect: { shopAdmin: 204, anonymous: 401, rest: 404 },
  },
  { route: 'GET /shops/:id/invitations', call: async (_c, w) => ({ path: `/shops/${w.shopId}/invitations` }), expect: { shopAdmin: 200, anonymous: 401, rest: 404 } },
  {
    route: 'POST /shops/:id/invitations',
    call: async (_c, w) => ({ path: `/shops/${w.shopId}/invitations`, body: { email: uniqueEmail('newtech') } }),
    expect: { shopAdmin: 201, unverified: 403, anonymous: 401, rest: 404 },
  },
  { route: 'GET /shops/:id/skaters', call: async (_c, w) => ({ path: `/shops/${w.shopId}/skaters` }), expect: { technician: 200, shopAdmin: 200, anonymous: 401, rest: 404 } },
  { route: 'GET /shop-invitations', call: same('/shop-invitations'), expect: signedIn(200) },
  {
    route: 'POST /shop-invitations/:id/accept',
    call: async (ctx, w) => ({ path: `/shop-invitations/${await fresh.invitation(ctx, w)}/accept` }),
    expect: { otherTechnician: 200, unverified: 403, anonymous: 401, rest: 404 },
  },
  { route: 'GET /admin/users', call: same('/admin/users'), expect: { admin: 200, anonymous: 401, rest: 403 } },
  { route: 'PATCH /admin/users/:id', call: async (_c, w) => ({ path: `/admin/users/${w.spareAccountId}`, body: { roles: ['skater'] } }), expect: { admin: 200, anonymous: 401, rest: 403 } },
  // Last: creating a shop gives the caller the shop_admin role, which no earlier case may see.
  { route: 'POST /shops', call: async () => ({ path: '/shops', body: { name: 'Caller Shop' } }), expect: { unverified: 403, anonymous: 401, rest: 201 } },
]

/** Every route the accounts routers declare, read from the routers themselves so a new route cannot be missed. */
function declaredRoutes(ctx: Ctx): string[] {
  const routers: Router[] = [authRoutes(ctx), skaterRoutes(ctx), shareRoutes(ctx), shopRoutes(ctx), adminRoutes(ctx)]
  return routers.flatMap((r) =>
    (r.stack as { route?: { path: string; methods: Record<string, boolean> } }[]).flatMap((layer) =>
      layer.route ? Object.keys(layer.route.methods).map((m) => `${m.toUpperCase()} ${layer.route!.path}`) : [],
    ),
  )
}

describe('role × route matrix', () => {
  let ctx: Ctx
  let world: World
  let app: ReturnType<typeof createApp>

  beforeAll(async () => {
    ctx = await createTestContext()
    app = createApp(ctx)
    world = await buildWorld(ctx)
  })
  afterAll(() => ctx.dispose())

  it('has a case for every declared route', () => {
    expect(cases.map((c) => c.route).sort()).toEqual(declaredRoutes(ctx).sort())
  })

  it(`answers every route for every caller as the policy says, and never leaks the skater to a stranger`, async () => {
    const failures: string[] = []
    let calls = 0
    for (const c of cases) {
      const method = c.route.split(' ')[0].toLowerCase() as 'get' | 'post' | 'patch' | 'delete'
      for (const caller of callerNames) {
        const { path, body } = await c.call(ctx, world, caller)
        const cookie = await cookieFor(ctx, world, caller)
        let req = request(app)[method](`/api${path}`).set('Origin', appOrigin(ctx))
        if (cookie) req = req.set('Cookie', cookie)
        const res = await (body === undefined ? req : req.send(body as object))
        calls++
        const wanted = c.expect[caller] ?? c.expect.rest
        if (res.status !== wanted) failures.push(`${c.route} as ${caller}: ${res.status}, expected ${wanted} ${JSON.stringify(res.body)}`)
        const text = JSON.stringify(res.body ?? '')
        if (strangers.includes(caller) && (text.includes(world.skaterId) || text.includes(SKATER_NAME))) failures.push(`${c.route} as ${caller} leaked the skater`)
      }
    }
    expect(failures).toEqual([])
    expect(calls).toBe(cases.length * callerNames.length)
  })
})
