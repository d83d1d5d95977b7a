import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { Analysis } from '../../server/entities/analysis.entity'
import { BladeBaseline } from '../../server/entities/blade-baseline.entity'
import { Photo } from '../../server/entities/photo.entity'
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

  it('queues real photos of the practice pair over five sharpenings, once, for the worker to measure', async () => {
    expect(await runSeeds(ctx, [demoAccountsStep, demoBladesStep, demoWearStep])).toEqual(['demo-accounts', 'demo-blades', 'demo-wear'])
    expect(await runSeeds(ctx, [demoAccountsStep, demoBladesStep, demoWearStep])).toEqual([])
    const app = createApp(ctx)
    const coach = agent(app, ctx)
    await coach.post('/api/auth/sign-in').send({ email: 'coach@glenmere.example', password: DEMO_PASSWORD }).expect(200)
    const attention = (await coach.get('/api/attention').expect(200)).body as { bladeId: string; pair: string; side: string; reasons: string[] }[]
    const left = attention.find((i) => i.pair === 'Practice skates' && i.side === 'left')!
    expect(left.reasons).toContain('last sharpened with a hockey-range root radius')

    // Nothing is measured by the seed itself: it queues rendered photos, a month apart, like any upload.
    const queued = await ctx.db.getRepository(Analysis).find({ where: { bladeId: left.bladeId }, order: { queuedAt: 'ASC' } })
    expect(queued.map((a) => a.status)).toEqual(['queued', 'queued', 'queued', 'queued', 'queued'])
    const days = queued.map((a) => Math.round((a.queuedAt.getTime() - queued[0]!.queuedAt.getTime()) / 86_400_000))
    expect(days).toEqual([0, 30, 60, 90, 120])
    const photos = await ctx.db.getRepository(Photo).findBy({ bladeId: left.bladeId })
    expect(new Set(photos.map((p) => p.sha256)).size).toBe(5)
    expect(photos.every((p) => p.width === 2000 && p.height === 1500)).toBe(true)
    expect(await ctx.queue.boss.getQueueSize('photo.analyze')).toBeGreaterThanOrEqual(10)
    const baseline = await ctx.db.getRepository(BladeBaseline).findOneByOrFail({ bladeId: left.bladeId })
    expect(baseline).toMatchObject({ analysisId: queued[0]!.id, markedByName: 'Sami Okoro' })

    const h = bladeHistorySchema.parse((await coach.get(`/api/blades/${left.bladeId}/history`).expect(200)).body)
    expect(h.projections.find((p) => p.metric === 'touchPointMm')!.band).toEqual({ min: 38, max: 44 }) // the coach's preference
  }, 240_000)
})
