import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { Analysis } from '../../server/entities/analysis.entity'
import { DEMO_PASSWORD, demoAccountsStep } from '../../server/seeds/demo-accounts'
import { demoBladesStep } from '../../server/seeds/demo-blades'
import { demoWearStep } from '../../server/seeds/demo-wear'
import { runSeeds } from '../../server/seeds/index'
import { bladeHistorySchema } from '../../shared/schemas/history'
import { analyzePhotoJob } from '../../workers/analyze-photo'
import { agent } from '../support/accounts'
import { createTestContext } from '../support/test-context'

describe('demo wear seed step', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>

  beforeAll(async () => {
    ctx = await createTestContext()
  })
  afterAll(() => ctx.dispose())

  it('queues real photos of the practice pair over five sharpenings, once, and the engine measures the drift', async () => {
    expect(await runSeeds(ctx, [demoAccountsStep, demoBladesStep, demoWearStep])).toEqual(['demo-accounts', 'demo-blades', 'demo-wear'])
    expect(await runSeeds(ctx, [demoAccountsStep, demoBladesStep, demoWearStep])).toEqual([])
    const app = createApp(ctx)
    const coach = agent(app, ctx)
    await coach.post('/api/auth/sign-in').send({ email: 'coach@glenmere.example', password: DEMO_PASSWORD }).expect(200)
    const attention = (await coach.get('/api/attention').expect(200)).body as { bladeId: string; pair: string; side: string; reasons: string[] }[]
    const left = attention.find((i) => i.pair === 'Practice skates' && i.side === 'left')!
    expect(left.reasons).toContain('last sharpened with a hockey-range root radius')

    // Nothing is measured until the worker runs: the seed only queues photos, like any upload.
    const queued = await ctx.db.getRepository(Analysis).find({ where: { bladeId: left.bladeId }, order: { queuedAt: 'ASC' } })
    expect(queued.map((a) => a.status)).toEqual(['queued', 'queued', 'queued', 'queued', 'queued'])
    for (const analysis of [queued[0]!, queued[4]!]) {
      expect(await analyzePhotoJob.handle(ctx, { analysisId: analysis.id })).toBe('done')
    }
    const h = bladeHistorySchema.parse((await coach.get(`/api/blades/${left.bladeId}/history`).expect(200)).body)
    expect(h.rows.map((r) => r.sharpeningsSoFar)).toEqual([6, 10])
    expect(h.baseline).toMatchObject({ kind: 'marked reference', markedBy: 'Sami Okoro' })
    // The seed moved the rendered touch point back 4 × 1.1 mm; the engine must see most of that, within its ±.
    const [first, last] = h.rows.map((r) => r.touchPointMm)
    expect(last! - first!).toBeGreaterThan(2.4)
    expect(last! - first!).toBeLessThan(6.4)
    expect(h.projections.find((p) => p.metric === 'touchPointMm')!.band).toEqual({ min: 38, max: 44 }) // the coach's preference
  }, 240_000)
})
