import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { DEMO_PASSWORD, demoAccountsStep } from '../../server/seeds/demo-accounts'
import { demoBladesStep } from '../../server/seeds/demo-blades'
import { demoWearStep } from '../../server/seeds/demo-wear'
import { runSeeds } from '../../server/seeds/index'
import { bladeHistorySchema } from '../../shared/schemas/history'
import { agent } from '../support/accounts'
import { createTestContext } from '../support/test-context'

describe('demo wear seed step', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>

  beforeAll(async () => {
    ctx = await createTestContext()
  })
  afterAll(() => ctx.dispose())

  it('gives the practice pair a measured history the coach sees on Home, once', async () => {
    expect(await runSeeds(ctx, [demoAccountsStep, demoBladesStep, demoWearStep])).toEqual(['demo-accounts', 'demo-blades', 'demo-wear'])
    expect(await runSeeds(ctx, [demoAccountsStep, demoBladesStep, demoWearStep])).toEqual([])
    const app = createApp(ctx)
    const coach = agent(app, ctx)
    await coach.post('/api/auth/sign-in').send({ email: 'coach@glenmere.example', password: DEMO_PASSWORD }).expect(200)
    const attention = (await coach.get('/api/attention').expect(200)).body as { bladeId: string; skater: string; pair: string; side: string; reasons: string[] }[]
    const left = attention.find((i) => i.pair === 'Practice skates' && i.side === 'left')!
    expect(left.skater).toBe('Tomas Reyvik')
    expect(left.reasons).toContain('last sharpened with a hockey-range root radius')
    const h = bladeHistorySchema.parse((await coach.get(`/api/blades/${left.bladeId}/history`).expect(200)).body)
    expect(h.rows.map((r) => r.sharpeningsSoFar)).toEqual([6, 7, 8, 9, 10])
    expect(h.baseline).toMatchObject({ kind: 'marked reference', markedBy: 'Sami Okoro' })
    const tp = h.projections.find((p) => p.metric === 'touchPointMm')!
    expect(tp.band).toEqual({ min: 38, max: 44 }) // the coach's preference for the skater
    expect(tp.line!.slope).toBeGreaterThan(0.5)
    const cmp = (await coach.get(`/api/blades/${left.bladeId}/compare/baseline`).expect(200)).body
    const removed = cmp.steelRemoved.map((s: { removedMm: number | null }) => s.removedMm).filter((v: number | null) => v !== null)
    expect(Math.max(...removed)).toBeGreaterThan(0.2) // 4 × 0.088 mm put in, seen through 0.008 mm edge noise
  })
})
