import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoAccountsStep } from '../../server/seeds/demo-accounts'
import { demoBladesStep } from '../../server/seeds/demo-blades'
import { runSeeds } from '../../server/seeds/index'
import { createTestContext } from '../support/test-context'

describe('demo blades seed step', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>

  beforeAll(async () => {
    ctx = await createTestContext()
  })
  afterAll(() => ctx.dispose())

  it('gives the demo skaters pairs, sharpenings and one queued photo, once', async () => {
    expect(await runSeeds(ctx, [demoAccountsStep, demoBladesStep])).toEqual(['demo-accounts', 'demo-blades'])
    expect(await runSeeds(ctx, [demoAccountsStep, demoBladesStep])).toEqual([])
    const [counts] = await ctx.db.query(
      `SELECT (SELECT count(*)::int FROM skate_pairs) AS pairs, (SELECT count(*)::int FROM blades) AS blades,
              (SELECT count(*)::int FROM sharpenings) AS sharpenings, (SELECT count(*)::int FROM analyses WHERE status = 'queued') AS queued`)
    expect(counts).toEqual({ pairs: 3, blades: 6, sharpenings: 4, queued: 1 })
    const [photo] = await ctx.db.query(`SELECT storage_key FROM photos`)
    expect(await ctx.storage.exists(photo.storage_key)).toBe(true)
  })
})
