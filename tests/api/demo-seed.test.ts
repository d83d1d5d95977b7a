import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { DEMO_PASSWORD, demoAccountsStep, demoPeople } from '../../server/seeds/demo-accounts'
import { runSeeds } from '../../server/seeds/index'
import { agent } from '../support/accounts'
import { createTestContext } from '../support/test-context'

describe('demo seed: the invented club', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>
  let app: ReturnType<typeof createApp>

  beforeAll(async () => {
    ctx = await createTestContext()
    app = createApp(ctx)
    expect(await runSeeds(ctx, [demoAccountsStep])).toEqual(['demo-accounts'])
  })
  afterAll(() => ctx.dispose())

  async function as(person: keyof typeof demoPeople) {
    const client = agent(app, ctx)
    await client.post('/api/auth/sign-in').send({ email: demoPeople[person].email, password: DEMO_PASSWORD }).expect(200)
    return client
  }

  it('runs once, and every printed sign-in works', async () => {
    expect(await runSeeds(ctx, [demoAccountsStep])).toEqual([])
    for (const line of demoAccountsStep.signIns) {
      const [email, password] = line.trim().split(/\s+/)
      await agent(app, ctx).post('/api/auth/sign-in').send({ email, password }).expect(200)
    }
  })

  it('gives each person the view the scenario promises', async () => {
    const names = async (person: keyof typeof demoPeople, path: string) =>
      ((await (await as(person)).get(path).expect(200)).body as { name: string }[]).map((s) => s.name)
    expect(await names('parent', '/api/skaters')).toEqual(['Jonas Haldor', 'Mila Haldor'])
    expect(await names('coach', '/api/roster')).toEqual(['Mila Haldor', 'Tomas Reyvik'])
    expect(await names('techOne', '/api/skaters')).toEqual(['Mila Haldor', 'Tomas Reyvik'])
    expect(await names('skater', '/api/skaters')).toEqual(['Tomas Reyvik'])
    expect(await names('admin', '/api/skaters')).toEqual([])
    const shops = (await (await as('shopAdmin')).get('/api/shops').expect(200)).body
    const members = (await (await as('shopAdmin')).get(`/api/shops/${shops[0].id}/members`).expect(200)).body
    expect(members.filter((m: { role: string }) => m.role === 'technician')).toHaveLength(2)
    const invitations = (await (await as('coach')).get('/api/shares').expect(200)).body.filter((s: { status: string }) => s.status === 'pending')
    expect(invitations.map((s: { skaterName: string }) => s.skaterName)).toEqual(['Jonas Haldor'])
  })
})
